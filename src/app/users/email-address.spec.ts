import { TestBed } from '@angular/core/testing';

import { EmailAddress } from './email-address';

/** The component showing `address`. */
function shown(address: string): HTMLElement {
  const fixture = TestBed.createComponent(EmailAddress);
  fixture.componentRef.setInput('address', address);
  fixture.detectChanges();
  return fixture.nativeElement as HTMLElement;
}

/** The address as rendered (its text and breaks, not Angular's comment anchors), each permitted break (`<wbr>`) written as `|`. */
const withBreaks = (host: HTMLElement) =>
  Array.from(host.childNodes, (node) => (node.nodeName === 'WBR' ? '|' : node.nodeType === Node.TEXT_NODE ? node.textContent : '')).join('');

describe('EmailAddress', () => {
  it('may break after the @ and before each dot, and nowhere else', () => {
    expect(withBreaks(shown('lucia.brandt@kestrelfen.example'))).toBe('lucia|.brandt@|kestrelfen|.example');
    expect(withBreaks(shown('night-desk@lab'))).toBe('night-desk@|lab');
  });

  it('reads as the address itself: nothing added between its parts', () => {
    expect(shown('lucia.brandt@kestrelfen.example').textContent).toBe('lucia.brandt@kestrelfen.example');
  });
});
