import { KESTREL_FEN_TIMING } from '@fixtures/stations/station-pair';
import type { AnalysisProfileInput } from '@shared/analysis';

/** The demo lab's two acceptance profiles (values within the trade's usual ranges; common practice, no source). */
export const DEMO_PROFILES: ReadonlyArray<{ name: string; description: string; parameters: AnalysisProfileInput }> = [
  {
    name: 'Nightly standard',
    description: 'Half the rounds tested, observed values against the thresholds: the everyday check of a night’s run.',
    parameters: { testSelection: { mode: 'fixed-fraction', fraction: 0.5 }, criterion: 'observed', chshTolerance: 0.03, qberTolerance: 0.05, epsilon: 1e-9 },
  },
  {
    name: 'Certified key',
    description: 'A quarter of the rounds tested, each by chance; confidence-corrected values and a positive finite key required.',
    parameters: {
      testSelection: { mode: 'bernoulli', probability: 0.25 },
      chshTolerance: 0.04,
      qberTolerance: 0.06,
      epsilon: 1e-10,
      criterion: 'certified',
      requirePositiveKey: true,
    },
  },
];

/** The demo lab's two setups and the demo people who lead their shifts. */
export const DEMO_SETUPS = [
  {
    name: 'Fen link',
    description: 'North Hall to Mill Lane over 2.4 km of campus fibre.',
    stationALabel: 'North Hall',
    stationBLabel: 'Mill Lane',
    profile: 'Nightly standard',
    shiftLeads: ['lucia.brandt@kestrelfen.example', 'ada.reyes@kestrelfen.example'],
    extraRecipients: ['night-desk@kestrelfen.example'],
    // 1.3 km in a straight line, and the stations' clock comparison (the two-station fixtures' timing).
    geometry: KESTREL_FEN_TIMING.geometry,
  },
  {
    name: 'Mill Lane bench',
    description: 'Both stations on one optical table in Mill Lane, 12 m of fibre: the reference pair.',
    stationALabel: 'Bench A',
    stationBLabel: 'Bench B',
    profile: 'Certified key',
    shiftLeads: ['ada.reyes@kestrelfen.example'],
    extraRecipients: [],
    geometry: null,
  },
] as const;
