import { faultLines, oneLine } from './fault-lines';

describe('fault lines', () => {
  it('says an error in one line with its code, however the driver built it', () => {
    const refused = Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:54329'), { code: 'ECONNREFUSED' });
    const terminated = Object.assign(new Error('terminating connection due to administrator command\n  at Parser'), { code: '57P01' });
    expect([oneLine(refused), oneLine(terminated), oneLine('plain words')]).toEqual([
      'connect ECONNREFUSED 127.0.0.1:54329',
      'terminating connection due to administrator command at Parser (57P01)',
      'plain words',
    ]);
  });

  it('counts a repeated fault instead of printing it, and says the count with the next line', () => {
    const lines: string[] = [];
    const report = faultLines('Job queue', (line) => lines.push(line));
    const refused = Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:54329'), { code: 'ECONNREFUSED' });
    for (let poll = 0; poll < 400; poll++) report(refused);
    report(new Error('Connection terminated unexpectedly'));
    expect(lines).toEqual([
      'Job queue: connect ECONNREFUSED 127.0.0.1:54329',
      'Job queue: Connection terminated unexpectedly (the previous fault 399 more times)',
    ]);
  });
});
