import { marginText, type MarginBin, type StationPairSummary, type TimingSummary } from '@shared/analysis';
import type { RunStationsDto } from '@shared/api';
import { formatCount } from '@shared/format/numbers';
import { ensureSpace, fields, fieldsHeight, grid, gridHeight, paragraph, subheading, type Field, type GridCell, type GridColumn } from './pdf-blocks';
import { cautionHeight, writeCaution } from './pdf-caution';
import { TONE, TYPE } from './pdf-style';
import { clockOffsetText, distanceText, notSpaceLikeText, smallestMarginText, TIMING_CAUTION, timingNotCheckedSentence } from './station-words';

/** The histogram's columns: the bins of rounds without space-like separation, then the others. */
const HISTOGRAM_COLUMNS: readonly GridColumn[] = [
  { header: 'Margin ÷ light time', width: 30 },
  { header: 'Not space-like', width: 20, align: 'right' },
  { header: 'Margin ÷ light time', width: 30 },
  { header: 'Space-like', width: 20, align: 'right' },
];

/**
 * The timing check: the geometry it used, the smallest margin, the rounds without space-like
 * separation and the caution that these rest on the lab's geometry; then the margin histogram, the
 * bins of the rounds without space-like separation beside those of the rest. When the timing was
 * not checked, the sentence why.
 */
export function writeStationTiming(doc: PDFKit.PDFDocument, pair: StationPairSummary, stations: RunStationsDto | null | undefined): void {
  const { timing } = pair;
  if (timing === null) {
    subheading(doc, 'Timing check');
    paragraph(doc, timingNotCheckedSentence(pair, stations), { colour: TONE.muted });
    return;
  }
  const rows = figureRows(timing, stations?.geometry?.stationDistanceM ?? null);
  // The caution is never parted from the figures it qualifies by a page break.
  subheading(doc, 'Timing check', fieldsHeight(doc, rows) + cautionHeight(doc, TIMING_CAUTION));
  fields(doc, rows);
  writeCaution(doc, TIMING_CAUTION);
  doc.y += 2;
  writeHistogram(doc, timing);
}

function figureRows(timing: TimingSummary, distanceM: number | null): Field[] {
  const lightTime = `light takes ${marginText(timing.lightTimePs)}${distanceM === null ? ' between the stations' : ''}`;
  const listed = timing.firstNotSpaceLike.map(formatCount).join(', ') + (timing.notSpaceLike > timing.firstNotSpaceLike.length ? ', …' : '');
  return [
    { label: 'Distance', value: distanceM === null ? lightTime : `${distanceText(distanceM)}: ${lightTime}` },
    { label: 'Clock offset', value: `station B's clock minus station A's, ${clockOffsetText(timing)}` },
    { label: 'Smallest margin', value: smallestMarginText(timing) },
    {
      label: 'Not space-like',
      value: `${notSpaceLikeText(timing)}${timing.notSpaceLike === 0 ? '' : `; ${timing.notSpaceLike === 1 ? 'round' : 'the first'}: ${listed}`}`,
      ...(timing.notSpaceLike > 0 ? { labelTone: TONE.threshold } : {}),
    },
    ...(timing.untimedRounds === 0 ? [] : [{ label: 'Without times', value: `${formatCount(timing.untimedRounds)} joined rounds lack a station's times and are not counted` }]),
  ];
}

/** The histogram of each round's smaller margin: the bins up to 0 (not space-like) beside the bins above 0. */
function writeHistogram(doc: PDFKit.PDFDocument, timing: TimingSummary): void {
  const notSpaceLike = timing.histogram.filter((bin) => bin.upTo !== null && bin.upTo <= 0);
  const spaceLike = timing.histogram.filter((bin) => bin.upTo === null || bin.upTo > 0);
  const cells = (bin: MarginBin | undefined): GridCell[] => (bin === undefined ? ['', ''] : [binText(bin), formatCount(bin.rounds)]);
  const rows = Array.from({ length: Math.max(notSpaceLike.length, spaceLike.length) }, (_, row) => [...cells(notSpaceLike[row]), ...cells(spaceLike[row])]);
  ensureSpace(doc, gridHeight(doc, HISTOGRAM_COLUMNS, rows));
  grid(doc, HISTOGRAM_COLUMNS, rows);
  paragraph(
    doc,
    `Each timed round counted once, by the smaller of its two margins (at station A's outcome and at station B's), in tenths of the light time ${marginText(timing.lightTimePs)}. ` +
      'A margin at or below 0 means light from the other station’s setting choice could have reached the station before it recorded its outcome.',
    { size: TYPE.small, colour: TONE.muted },
  );
}

/** A bin as an interval of light times, open below and closed above: "(−0.6, −0.5]", "(1, ∞)". */
function binText(bin: MarginBin): string {
  const edge = (value: number) => String(value).replace('-', '−');
  const above = bin.above === null ? '(−∞' : `(${edge(bin.above)}`;
  return bin.upTo === null ? `${above}, ∞)` : `${above}, ${edge(bin.upTo)}]`;
}
