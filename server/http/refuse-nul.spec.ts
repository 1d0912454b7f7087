import type { NextFunction, Request, Response } from 'express';
import { HttpError } from './http-error';
import { refuseNulCharacters } from './refuse-nul';

/** What the middleware passes to `next` for this query and body. */
function passed(query: object, body: unknown): unknown {
  let argument: unknown = 'next not called';
  refuseNulCharacters({ query, body } as Request, {} as Response, ((value?: unknown) => (argument = value)) as NextFunction);
  return argument;
}

describe('refuseNulCharacters', () => {
  it('passes a request without a NUL character on', () => {
    expect(passed({ targetId: "' OR 1=1 --" }, { name: 'Fen link', shiftLeadIds: [3, 5], nested: { note: 'ℵ' } })).toBeUndefined();
    expect(passed({}, undefined)).toBeUndefined();
  });

  it('answers 400 naming the query parameter, the nested body field, or the key that holds one', () => {
    const cases: Array<[object, unknown, string]> = [
      [{ targetId: 'run\u0000' }, undefined, 'targetId'],
      [{ state: ['queued', '\u0000'] }, undefined, 'state.1'],
      [{}, { extraRecipients: ['night-desk@kestrelfen.example', 'a\u0000@kestrelfen.example'] }, 'extraRecipients.1'],
      [{}, { parameters: { testSelection: { mode: 'bernoulli\u0000' } } }, 'parameters.testSelection.mode'],
      [{}, { 'name\u0000': 'x' }, 'name\u0000'],
    ];
    for (const [query, body, field] of cases) {
      const error = passed(query, body);
      expect(error).toBeInstanceOf(HttpError);
      expect(error).toMatchObject({ status: 400, field, message: `${field}: must not contain a NUL character` });
    }
  });
});
