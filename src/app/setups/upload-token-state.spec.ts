import { uploadTokenState } from './upload-token-state';

describe('uploadTokenState', () => {
  const now = new Date('2027-03-14T09:00:00Z');

  it('is in use until it expires', () => {
    expect(uploadTokenState({ expiresAt: '2027-03-14T09:00:01Z', revokedAt: null }, now)).toEqual({ word: 'In use', icon: 'key', live: true });
    expect(uploadTokenState({ expiresAt: '2027-03-14T09:00:00Z', revokedAt: null }, now)).toEqual({ word: 'Expired', icon: 'timer_off', live: false });
  });

  it('says revoked for a revoked token, expired or not', () => {
    expect(uploadTokenState({ expiresAt: '2027-06-01T00:00:00Z', revokedAt: '2027-03-01T10:00:00Z' }, now).word).toBe('Revoked');
    expect(uploadTokenState({ expiresAt: '2027-03-02T00:00:00Z', revokedAt: '2027-03-01T10:00:00Z' }, now).word).toBe('Revoked');
  });
});
