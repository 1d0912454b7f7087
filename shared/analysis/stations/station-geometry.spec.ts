import { timingFrame } from './station-geometry';

describe('timingFrame', () => {
  it('turns the setup figures into whole picoseconds, each rounded against the lab', () => {
    // 1.3 km: 4 336 333.24 ps, down to 4 336 333; −123 456.789 ns is −123 456 789 ps; 1.5004 ns up to 1 501 ps.
    expect(timingFrame({ stationDistanceM: 1300, clockOffsetNs: -123_456.789, clockUncertaintyNs: 1.5004 })).toEqual({
      lightTimePs: 4_336_333n,
      clockOffsetPs: -123_456_789n,
      clockUncertaintyPs: 1_501n,
    });
    expect(timingFrame({ stationDistanceM: 2, clockOffsetNs: 0.0004, clockUncertaintyNs: 0 })).toEqual({ lightTimePs: 6_671n, clockOffsetPs: 0n, clockUncertaintyPs: 0n });
  });

  it('refuses figures outside what a setup accepts, naming the field', () => {
    const fine = { stationDistanceM: 1300, clockOffsetNs: 0, clockUncertaintyNs: 1 };
    expect(() => timingFrame({ ...fine, stationDistanceM: 0 })).toThrow('stationDistanceM must be above 0 and at most 10⁹ m, not 0');
    expect(() => timingFrame({ ...fine, clockOffsetNs: 2e12 })).toThrow('clockOffsetNs must be within ±10¹² ns, not 2000000000000');
    expect(() => timingFrame({ ...fine, clockUncertaintyNs: -1 })).toThrow('clockUncertaintyNs must be 0 … 10¹² ns, not -1');
    expect(() => timingFrame({ ...fine, clockUncertaintyNs: Number.NaN })).toThrow('clockUncertaintyNs');
  });
});
