import { TestBed } from '@angular/core/testing';

import { LogDrop } from './log-drop';

describe('LogDrop', () => {
  function drop(): { host: HTMLElement; picked: File[] } {
    const fixture = TestBed.createComponent(LogDrop);
    fixture.componentRef.setInput('prompt', 'Drop station A’s log here, or');
    fixture.componentRef.setInput('chooseLabel', 'Choose station A’s log');
    fixture.componentRef.setInput('fileLabel', 'Station A’s log file');
    fixture.componentRef.setInput('testId', 'station-a');
    const picked: File[] = [];
    fixture.componentInstance.picked.subscribe((file) => picked.push(file));
    fixture.detectChanges();
    return { host: fixture.nativeElement as HTMLElement, picked };
  }

  it('names its area and file field, and gives the file dropped on it', () => {
    const { host, picked } = drop();
    const input = host.querySelector<HTMLInputElement>('[data-testid="station-a-input"]')!;
    expect(input.getAttribute('aria-label')).toBe('Station A’s log file');
    expect(host.querySelector('button')!.textContent).toBe('Choose station A’s log');

    const file = new File(['round,x,a\n'], 'north-hall.csv');
    const event = new Event('drop', { cancelable: true }) as DragEvent;
    Object.defineProperty(event, 'dataTransfer', { value: { files: { item: () => file } } });
    host.querySelector('[data-testid="station-a-drop"]')!.dispatchEvent(event);
    expect(picked).toEqual([file]);
    expect(event.defaultPrevented).toBe(true);
  });

  it('gives the file chosen in the field', () => {
    const { host, picked } = drop();
    const input = host.querySelector<HTMLInputElement>('[data-testid="station-a-input"]')!;
    const file = new File(['round,x,a\n'], 'north-hall.csv');
    Object.defineProperty(input, 'files', { value: { item: () => file } });
    input.dispatchEvent(new Event('change'));
    expect(picked).toEqual([file]);
  });
});
