import { TestBed } from '@angular/core/testing';

import { specSetup } from '../../testing/spec-setup';
import { SetupFacts } from './setup-facts';

describe('SetupFacts', () => {
  it('gives the light time between the stations in vacuum, to the picosecond', () => {
    const fixture = TestBed.createComponent(SetupFacts);
    fixture.componentRef.setInput('setup', specSetup({ stationDistanceM: 1200, clockOffsetNs: 12.5, clockUncertaintyNs: 2 }));
    fixture.detectChanges();
    const text = (fixture.nativeElement as HTMLElement).textContent.replace(/[ \n]+/g, ' ');
    // 1200 m / 299 792 458 m/s = 4.002 769 23… µs, rounded down to the picosecond.
    expect(text).toContain('Distance1\u2009200 m: light takes 4\u2009002.769\u2009ns');
    expect(text).toContain('B − A = 12.5 ± 2 ns');
  });
});
