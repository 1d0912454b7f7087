import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter } from '@angular/router';

import { AUDIT_ACTIONS, type AuditEventDto, type AuditPageDto } from '@shared/api';
import { ACTION_FAMILIES } from './audit-words';
import { SystemTrail } from './system-trail';

const lines: AuditEventDto[] = [
  { id: 41, actor: 'Sami Virtanen', action: 'run.exported', targetType: 'run', targetId: '12', targetName: null, details: { format: 'json' }, createdAt: '2027-03-02T09:20:00Z' },
  {
    id: 40,
    actor: null,
    action: 'run.reverification-finished',
    targetType: 'run',
    targetId: '12',
    targetName: null,
    details: { state: 'reproduced' },
    createdAt: '2027-03-02T09:03:00Z',
  },
  {
    id: 7,
    actor: 'Ines Halloran',
    action: 'profile.version-created',
    targetType: 'profile',
    targetId: '2',
    targetName: 'Nightly standard',
    details: { version: 3 },
    createdAt: '2026-11-02T08:00:00Z',
  },
];

const pageOf = (items: AuditEventDto[]): AuditPageDto => ({ items, total: items.length, page: 0, pageSize: 50 });

/** Past the pause the trail waits for while someone types or picks. */
const pause = () => new Promise((resolve) => setTimeout(resolve, 400));

describe('SystemTrail', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<SystemTrail>;
  let host: HTMLElement;

  const trailRequests = (): TestRequest[] => http.match((request) => request.url === '/api/audit');

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SystemTrail);
    host = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    http.expectOne('/api/audit/actors').flush([{ id: 5, name: 'Sami Virtanen' }]);
  });

  afterEach(() => http.verify());

  it('shows who, what in words, what about (a run links to its page) and the detail', async () => {
    trailRequests()[0].flush(pageOf(lines));
    await fixture.whenStable();

    const rows = Array.from(host.querySelectorAll('[data-testid="audit-trail"] tbody tr'), (row) =>
      Array.from(row.querySelectorAll('td'), (cell) => cell.textContent?.trim()).slice(1),
    );
    expect(rows).toEqual([
      ['Sami Virtanen', 'Exported', 'Run 12', 'JSON report'],
      ['System', 'Re-verification finished', 'Run 12', 'Reproduced'],
      ['Ines Halloran', 'Profile version added', 'Nightly standard', 'Version 3'],
    ]);
    expect(Array.from(host.querySelectorAll('[data-testid="audit-trail"] a'), (link) => link.getAttribute('href'))).toEqual(['/runs/12', '/runs/12']);
  });

  it('narrows the trail to an action family and exports what the filters leave', async () => {
    trailRequests()[0].flush(pageOf(lines));
    await fixture.whenStable();

    const loader = TestbedHarnessEnvironment.loader(fixture);
    const action = await loader.getHarness(MatSelectHarness.with({ selector: '[formControlName="action"]' }));
    await action.open();
    await action.clickOptions({ text: 'Any run action' });
    await pause();
    await fixture.whenStable();
    const [narrowed] = trailRequests();
    expect(narrowed.request.params.get('action')).toBe('run.');
    expect(narrowed.request.params.get('page')).toBe('0');
    narrowed.flush(pageOf(lines.slice(0, 2)));
    await fixture.whenStable();

    // jsdom has no object URLs and no downloads: stand in for the browser's.
    Object.assign(URL, { createObjectURL: jest.fn(() => 'blob:bellkeep/trail'), revokeObjectURL: jest.fn() });
    const click = jest.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => undefined);
    host.querySelector<HTMLButtonElement>('[data-testid="audit-export-csv"]')!.click();
    const exported = http.expectOne((request) => request.url === '/api/audit/export.csv');
    expect(exported.request.params.keys()).toEqual(['action']);
    expect(exported.request.params.get('action')).toBe('run.');
    exported.flush(new Blob(['id,when\n']), { headers: { 'Content-Disposition': 'attachment; filename="bellkeep-trail.csv"' } });
    expect(click).toHaveBeenCalledTimes(1);
    click.mockRestore();
  });
});

describe('ACTION_FAMILIES', () => {
  it('offers every recorded action under exactly one family', () => {
    const offered = ACTION_FAMILIES.flatMap((family) => family.actions.map((action) => action.value));
    expect([...offered].sort()).toEqual([...AUDIT_ACTIONS].sort());
  });
});
