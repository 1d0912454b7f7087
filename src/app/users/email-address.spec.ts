import { TestBed } from '@angular/core/testing';

import { EmailAddress } from './email-address';

/** The component showing `address`. */
function shown(address: string): HTMLElement {
  const fixture = TestBed.createComponent(EmailAddress);
  fixture.componentRef.setInput('address', address);
  fixture.detectChanges();
  return fixture.nativeElement as HTMLElement;
}

/** The address as rendered (its parts and breaks, not Angular's comment anchors), each permitted break (`<wbr>`) written as `|`. */
const withBreaks = (host: HTMLElement) => Array.from(host.childNodes, (node) => (node.nodeName === 'WBR' ? '|' : node.nodeName === 'SPAN' ? node.textContent : '')).join('');

describe('EmailAddress', () => {
  it('may break after the @ and before each dot, and nowhere else', () => {
    expect(withBreaks(shown('lucia.brandt@kestrelfen.example'))).toBe('lucia|.brandt@|kestrelfen|.example');
    expect(withBreaks(shown('night-desk@lab'))).toBe('night-desk@|lab');
  });

  it('keeps each part whole (its style keeps it on one line), so a hyphen never breaks it', () => {
    const parts = Array.from(shown('night-desk@kestrelfen.example').querySelectorAll('span'));
    expect(parts.map((part) => part.textContent)).toEqual(['night-desk@', 'kestrelfen', '.example']);
    for (const part of parts) expect(part.classList).toContain('bk-email-part');
  });

  it('reads as the address itself: nothing added between its parts', () => {
    expect(shown('lucia.brandt@kestrelfen.example').textContent).toBe('lucia.brandt@kestrelfen.example');
  });
});
