import { runLinkParts } from './run-link-parts';

describe('runLinkParts', () => {
  it('links every run named in the sentence and keeps the words around them', () => {
    expect(runLinkParts('Other attempts: 1 — run 12, ABORT; 3 — run 15, queued.')).toEqual([
      { text: 'Other attempts: 1 — ' },
      { text: 'run 12', runId: 12 },
      { text: ', ABORT; 3 — ' },
      { text: 'run 15', runId: 15 },
      { text: ', queued.' },
    ]);
  });

  it('leaves a sentence without a run as it is', () => {
    expect(runLinkParts('Seed committed at booking, before acquisition: SHA-256 777ddf8c.')).toEqual([
      { text: 'Seed committed at booking, before acquisition: SHA-256 777ddf8c.' },
    ]);
  });

  it('reads "run" only as a word followed by a number', () => {
    expect(runLinkParts('The rerun 4 and the runs 5 stay; run 6 ends it')).toEqual([
      { text: 'The rerun 4 and the runs 5 stay; ' },
      { text: 'run 6', runId: 6 },
      { text: ' ends it' },
    ]);
  });

  it('puts the pieces back together as the sentence', () => {
    const sentence = 'Replay: these bytes were uploaded before as run 9, under another booking or night.';
    expect(
      runLinkParts(sentence)
        .map((part) => part.text)
        .join(''),
    ).toBe(sentence);
  });
});
