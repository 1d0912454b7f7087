import { TestBed } from '@angular/core/testing';

import { TextWithAddresses, textParts } from './text-with-addresses';

describe('TextWithAddresses', () => {
  it('finds each address in a sentence, leaving commas and a full stop outside it', () => {
    expect(textParts('To lucia.brandt@kestrelfen.example, night-desk@kestrelfen.example.')).toEqual([
      { text: 'To ', address: false },
      { text: 'lucia.brandt@kestrelfen.example', address: true },
      { text: ', ', address: false },
      { text: 'night-desk@kestrelfen.example', address: true },
      { text: '.', address: false },
    ]);
    expect(textParts('Verdict ACCEPT')).toEqual([{ text: 'Verdict ACCEPT', address: false }]);
  });

  it('shows the addresses as bk-email-address, the text reading as it was', async () => {
    const fixture = TestBed.createComponent(TextWithAddresses);
    fixture.componentRef.setInput('text', 'To ada.reyes@kestrelfen.example, night-desk@kestrelfen.example');
    await fixture.whenStable();
    const host = fixture.nativeElement as HTMLElement;
    expect(Array.from(host.querySelectorAll('bk-email-address'), (address) => address.textContent)).toEqual(['ada.reyes@kestrelfen.example', 'night-desk@kestrelfen.example']);
    expect(host.textContent).toBe('To ada.reyes@kestrelfen.example, night-desk@kestrelfen.example');
  });
});
