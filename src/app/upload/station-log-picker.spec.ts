import { TestBed } from '@angular/core/testing';

import { StationLogPicker } from './station-log-picker';

describe('StationLogPicker', () => {
  function picker(): { component: StationLogPicker; host: HTMLElement; detect: () => void } {
    const fixture = TestBed.createComponent(StationLogPicker);
    fixture.componentRef.setInput('station', 'B');
    fixture.componentRef.setInput('stationLabel', 'Mill Lane');
    fixture.detectChanges();
    return { component: fixture.componentInstance, host: fixture.nativeElement as HTMLElement, detect: () => fixture.detectChanges() };
  }

  it('is named by its station, reads the picked file as that station’s log, and forgets it on Remove', async () => {
    const { component, host, detect } = picker();
    expect(host.querySelector('h3')!.textContent).toBe('Station B · Mill Lane');
    expect(host.textContent).toContain('Columns round, y, b (and t_setting, t_outcome, both or neither).');

    const file = new File(['round,y,b\n1,2,0\n2,0,1\n'], 'mill-lane.csv');
    await component.chooseLog(file);
    detect();
    expect(component.log()).toMatchObject({ file, compressed: false, check: { ok: true, records: 2 } });
    expect(host.querySelector('[data-testid="station-b-file"]')!.textContent).toContain('mill-lane.csv');

    host.querySelector<HTMLButtonElement>('button[aria-label="Remove station B’s log"]')!.click();
    detect();
    expect(component.log()).toBeNull();
    expect(host.querySelector('[data-testid="station-b-file"]')).toBeNull();
  });
});
