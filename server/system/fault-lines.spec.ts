import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { faultLines, isDatabaseUnreachable, oneLine } from './fault-lines';

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
    expect(lines).toEqual(['Job queue: connect ECONNREFUSED 127.0.0.1:54329', 'Job queue: Connection terminated unexpectedly (the previous fault 399 more times)']);
  });

  it('tells the database being away (pg, Sequelize and socket codes) from any other error', () => {
    const away = [
      Object.assign(new Error('the database system is shutting down'), { code: '57P03' }),
      Object.assign(new Error('terminating connection due to administrator command'), { code: '57P01' }),
      Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:54329'), { code: 'ECONNREFUSED' }),
      Object.assign(new Error('connect ECONNREFUSED 127.0.0.1:54329'), { name: 'SequelizeConnectionRefusedError', parent: { code: 'ECONNREFUSED' } }),
      new Error('Connection terminated unexpectedly'),
    ];
    const bugs = [new TypeError("Cannot read properties of undefined (reading 'id')"), Object.assign(new Error('duplicate key value'), { code: '23505' }), 'a string'];
    expect(away.map(isDatabaseUnreachable)).toEqual(away.map(() => true));
    expect(bugs.map(isDatabaseUnreachable)).toEqual(bugs.map(() => false));
  });

  /** A Node process that meets `rejection` unhandled under endOnUnhandledFaults: its exit code and outputs. */
  function processMeeting(rejection: string) {
    const script = `
      const { endOnUnhandledFaults } = require(${JSON.stringify(path.join(__dirname, 'fault-lines.ts'))});
      endOnUnhandledFaults('Worker 7');
      Promise.reject(${rejection});
      setTimeout(() => { process.stdout.write('still here'); process.exit(0); }, 200);`;
    const outcome = spawnSync(process.execPath, ['--import', 'tsx', '-e', script], { encoding: 'utf8', timeout: 20_000 });
    return { status: outcome.status, stdout: outcome.stdout, stderr: outcome.stderr };
  }

  it('goes on after an unheard rejection that says only that the database was away, and ends on any other', () => {
    expect(processMeeting("Object.assign(new Error('the database system is shutting down'), { code: '57P03' })")).toEqual({
      status: 0,
      stdout: 'still here',
      stderr: 'Worker 7: the database system is shutting down (57P03)\n',
    });
    expect(processMeeting("new TypeError('x is not a function')")).toEqual({ status: 1, stdout: '', stderr: 'Worker 7: stopped by an unhandled error: x is not a function\n' });
  });
});
