import { LOCAL_CHSH_VALUE, LOCAL_WIN_FRACTION, QUANTUM_CHSH_VALUE, QUANTUM_WIN_FRACTION } from './bell-bounds';
import { chshValueFromWinFraction } from './chsh-value';

describe('Bell bounds', () => {
  it('puts the quantum win fraction at cos²(π/8) ≈ 0.853553', () => {
    // Tsirelson 1980: ω_Q = cos²(π/8) = (2+√2)/4 ≈ 0.853553.
    expect(QUANTUM_WIN_FRACTION).toBeCloseTo(Math.cos(Math.PI / 8) ** 2, 15);
    expect(QUANTUM_WIN_FRACTION).toBeCloseTo(0.853553, 6);
  });

  it('maps the win-fraction bounds onto the S bounds through S = 8ω − 4', () => {
    // CHSH 1969: local bound 3/4 ↔ S = 2; Tsirelson 1980: ω_Q ↔ S = 2√2.
    expect(LOCAL_WIN_FRACTION).toBe(0.75);
    expect(chshValueFromWinFraction(LOCAL_WIN_FRACTION)).toBe(LOCAL_CHSH_VALUE);
    expect(chshValueFromWinFraction(QUANTUM_WIN_FRACTION)).toBeCloseTo(QUANTUM_CHSH_VALUE, 12);
  });
});
