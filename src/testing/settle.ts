import type { ComponentFixture } from '@angular/core/testing';

/** Change detection, then `milliseconds` of jest's fake time (a debounce, a poll), then change detection again. */
export async function settle(fixture: ComponentFixture<unknown>, milliseconds = 0): Promise<void> {
  fixture.detectChanges();
  await jest.advanceTimersByTimeAsync(milliseconds);
  fixture.detectChanges();
}
