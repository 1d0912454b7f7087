import { type AnalysisResult, type FractionInterval, LOCAL_WIN_FRACTION, QUANTUM_WIN_FRACTION, winThresholdOf } from '@shared/analysis';
import { formatFixed, formatPercent, formatScientific } from '@shared/format/numbers';
import { ensureSpace, paragraph, textColumn, useType } from './pdf-blocks';
import { TONE, TYPE, WIN_DECIMALS } from './pdf-style';

/** A horizontal dashed line across the plot, named at its right end. */
interface Guide {
  label: string;
  value: number;
  tone: string;
}

/** One panel: per-block values with their intervals, the side of the threshold that fails, the guides. */
interface DriftPanel {
  title: string;
  axis: string;
  intervals: FractionInterval[];
  failsBelow: boolean;
  threshold: number;
  guides: Guide[];
  min: number;
  max: number;
  tick: (value: number) => string;
  format: (value: number) => string;
}

/** Heights of one panel: its title, the plot, the x axis with its labels. */
const PANEL = { title: 12, plot: 118, axis: 24 } as const;

/** Up to this many failing blocks are named one by one under a panel; more are counted. */
const LISTED_BLOCKS = 20;

/** Room left of the plot for the y labels, right of it for the names of the guides. */
const GUTTER = { left: 46, right: 104 } as const;

/**
 * The stationarity plot, drawn with vector lines: per-block CHSH win fraction and QBER as points
 * with their Hoeffding intervals, the thresholds, the quantum maximum and the local bound dashed;
 * blocks on the failing side of a threshold drawn as crosses, and listed below each panel.
 */
export function writeDriftChart(doc: PDFKit.PDFDocument, result: AnalysisResult): void {
  const { blocks, profile } = result;
  if (blocks.length === 0) {
    paragraph(doc, 'No blocks to plot: the log had no readable rounds.', { colour: TONE.muted });
    return;
  }
  const winThreshold = winThresholdOf(result);
  const wins = blocks.map((block) => block.chsh);
  const rates = blocks.map((block) => block.qber);
  const highestRate = Math.max(profile.qberTolerance * 1.6, ...rates.flatMap(({ upper }) => (upper === null ? [] : [upper])));
  const lowestWin = Math.min(LOCAL_WIN_FRACTION - 0.02, ...wins.flatMap(({ lower }) => (lower === null ? [] : [lower])));
  const highestWin = Math.max(QUANTUM_WIN_FRACTION + 0.02, ...wins.flatMap(({ upper }) => (upper === null ? [] : [upper])));
  drawPanel(doc, {
    title: 'CHSH win fraction per block',
    axis: 'win fraction',
    intervals: wins,
    failsBelow: true,
    threshold: winThreshold,
    guides: [
      { label: `threshold ${formatFixed(winThreshold)}`, value: winThreshold, tone: TONE.threshold },
      { label: 'quantum max. (2+√2)/4', value: QUANTUM_WIN_FRACTION, tone: TONE.accept },
      { label: 'local bound 3/4', value: LOCAL_WIN_FRACTION, tone: TONE.invalid },
    ],
    min: Math.max(0, Math.floor(lowestWin * 50) / 50),
    max: Math.min(1, Math.ceil(highestWin * 50) / 50),
    tick: (value) => formatFixed(value, 2),
    format: (value) => formatFixed(value, WIN_DECIMALS),
  });
  drawPanel(doc, {
    title: 'QBER per block',
    axis: 'QBER',
    intervals: rates,
    failsBelow: false,
    threshold: profile.qberTolerance,
    guides: [{ label: `tolerance ${formatPercent(profile.qberTolerance)}`, value: profile.qberTolerance, tone: TONE.threshold }],
    min: 0,
    max: Math.min(1, Math.ceil(highestRate * 50) / 50),
    tick: (value) => formatPercent(value, 0),
    format: (value) => formatPercent(value),
  });
  paragraph(
    doc,
    `● observed value of a block; vertical bar: its Hoeffding interval at ε = ${formatScientific(profile.epsilon)}; ` +
      '× a block on the failing side of the threshold; dashed: the lines named at the right.',
    { size: TYPE.small, colour: TONE.muted },
  );
}

/** Where a panel's plot sits on the page, and where a block or a value falls in it. */
interface Frame {
  left: number;
  top: number;
  width: number;
  bottom: number;
  /** Width given to each block. */
  slot: number;
  xOf: (index: number) => number;
  yOf: (value: number) => number;
}

function drawPanel(doc: PDFKit.PDFDocument, panel: DriftPanel): void {
  const { left, width } = textColumn(doc);
  ensureSpace(doc, PANEL.title + PANEL.plot + PANEL.axis + 14);
  useType(doc, 'bold', TYPE.body).text(panel.title, left, doc.y, { width });
  const top = doc.y + 4;
  const bottom = top + PANEL.plot;
  const plotLeft = left + GUTTER.left;
  const plotWidth = width - GUTTER.left - GUTTER.right;
  const slot = plotWidth / panel.intervals.length;
  const frame: Frame = {
    left: plotLeft,
    top,
    width: plotWidth,
    bottom,
    slot,
    xOf: (index) => plotLeft + (index + 0.5) * slot,
    yOf: (value) => bottom - ((clamp(value, panel.min, panel.max) - panel.min) / (panel.max - panel.min)) * PANEL.plot,
  };
  drawValueAxis(doc, panel, frame, left);
  drawGuides(doc, panel.guides, frame);
  const failing = drawBlocks(doc, panel, frame);
  drawBlockAxis(doc, panel.intervals.length, frame);
  doc.y = bottom + PANEL.axis;
  paragraph(doc, blocksInWords(panel, failing), { size: TYPE.small, colour: TONE.muted });
  doc.y += 4;
}

/** Grid lines at round values, their labels, and the axis name written upwards. */
function drawValueAxis(doc: PDFKit.PDFDocument, panel: DriftPanel, frame: Frame, labelLeft: number): void {
  for (const tick of ticks(panel.min, panel.max)) {
    const y = frame.yOf(tick);
    doc
      .moveTo(frame.left, y)
      .lineTo(frame.left + frame.width, y)
      .lineWidth(0.3)
      .strokeColor(TONE.rule)
      .stroke();
    useType(doc, 'body', TYPE.small, TONE.muted).text(panel.tick(tick), labelLeft, y - TYPE.small / 2 - 1, { width: GUTTER.left - 14, align: 'right', lineBreak: false });
  }
  const height = frame.bottom - frame.top;
  const middle = frame.top + height / 2;
  doc.save().rotate(-90, { origin: [labelLeft + 3, middle] });
  useType(doc, 'body', TYPE.small, TONE.muted).text(panel.axis, labelLeft + 3 - height / 2, middle - TYPE.small / 2, { width: height, align: 'center', lineBreak: false });
  doc.restore();
  doc.moveTo(frame.left, frame.top).lineTo(frame.left, frame.bottom).lineWidth(0.6).strokeColor(TONE.text).stroke();
}

/** The block numbers along the bottom (at most about twenty of them) and the axis name. */
function drawBlockAxis(doc: PDFKit.PDFDocument, blocks: number, frame: Frame): void {
  doc
    .moveTo(frame.left, frame.bottom)
    .lineTo(frame.left + frame.width, frame.bottom)
    .lineWidth(0.6)
    .strokeColor(TONE.text)
    .stroke();
  const every = Math.ceil(blocks / 20);
  for (let index = 0; index < blocks; index++) {
    // The last block is numbered too, unless its label would touch the one before.
    const last = index === blocks - 1 && (index % every) * frame.slot >= 18;
    if (index % every !== 0 && !last) continue;
    const x = frame.xOf(index);
    doc
      .moveTo(x, frame.bottom)
      .lineTo(x, frame.bottom + 2.5)
      .lineWidth(0.5)
      .strokeColor(TONE.text)
      .stroke();
    useType(doc, 'body', TYPE.small, TONE.muted).text(String(index + 1), x - 12, frame.bottom + 3.5, { width: 24, align: 'center', lineBreak: false });
  }
  useType(doc, 'body', TYPE.small, TONE.muted).text(`block of consecutive rounds (${blocks} blocks)`, frame.left, frame.bottom + 13, {
    width: frame.width,
    align: 'center',
    lineBreak: false,
  });
}

function drawGuides(doc: PDFKit.PDFDocument, guides: readonly Guide[], frame: Frame): void {
  for (const guide of guides) {
    const y = frame.yOf(guide.value);
    doc
      .save()
      .moveTo(frame.left, y)
      .lineTo(frame.left + frame.width, y)
      .lineWidth(0.9)
      .dash(4, { space: 2.5 })
      .strokeColor(guide.tone)
      .stroke()
      .restore();
  }
  writeGuideLabels(doc, guides, frame.left + frame.width + 4, frame.yOf);
}

/** Each block's interval as a capped bar and its value as a dot, or a cross when it fails; returns the failing block numbers. */
function drawBlocks(doc: PDFKit.PDFDocument, panel: DriftPanel, frame: Frame): number[] {
  // Marks shrink with the blocks, so a thousand of them still read as points.
  const mark = Math.min(1, frame.slot / 10);
  const cap = Math.min(3, frame.slot * 0.3);
  const failing: number[] = [];
  panel.intervals.forEach((interval, index) => {
    if (interval.fraction === null || interval.lower === null || interval.upper === null) return;
    const x = frame.xOf(index);
    const [low, high] = [frame.yOf(interval.lower), frame.yOf(interval.upper)];
    doc.lineWidth(0.7 * Math.max(mark, 0.5)).strokeColor(TONE.primary);
    doc
      .moveTo(x, low)
      .lineTo(x, high)
      .moveTo(x - cap, low)
      .lineTo(x + cap, low)
      .moveTo(x - cap, high)
      .lineTo(x + cap, high)
      .stroke();
    if (panel.failsBelow ? interval.fraction < panel.threshold : interval.fraction > panel.threshold) {
      failing.push(index + 1);
      drawCross(doc, x, frame.yOf(interval.fraction), 3.2 * Math.max(mark, 0.4));
    } else {
      doc.circle(x, frame.yOf(interval.fraction), 2.1 * Math.max(mark, 0.3)).fill(TONE.primary);
    }
  });
  return failing;
}

/** The panel in one sentence: the observed range and the blocks on the failing side. */
function blocksInWords(panel: DriftPanel, failing: readonly number[]): string {
  const observed = panel.intervals.flatMap(({ fraction }) => (fraction === null ? [] : [fraction]));
  const range = observed.length === 0 ? 'No block has test rounds' : `Observed from ${panel.format(Math.min(...observed))} to ${panel.format(Math.max(...observed))}`;
  const side =
    failing.length === 0
      ? 'every block on the passing side of the threshold'
      : failing.length > LISTED_BLOCKS
        ? `${failing.length} of ${panel.intervals.length} blocks on the failing side of the threshold`
        : `block${failing.length === 1 ? '' : 's'} ${failing.join(', ')} on the failing side of the threshold`;
  return `${range}; ${side}.`;
}

/** The guides' names at the right end of their lines, nudged apart where lines lie close. */
function writeGuideLabels(doc: PDFKit.PDFDocument, guides: readonly Guide[], x: number, yOf: (value: number) => number): void {
  const gap = TYPE.small + 1.5;
  let previous = -Infinity;
  for (const guide of [...guides].sort((a, b) => yOf(a.value) - yOf(b.value))) {
    const y = Math.max(yOf(guide.value) - TYPE.small / 2 - 1, previous + gap);
    useType(doc, 'body', TYPE.small, guide.tone).text(guide.label, x, y, { lineBreak: false });
    previous = y;
  }
}

function drawCross(doc: PDFKit.PDFDocument, x: number, y: number, size: number): void {
  doc.save().lineWidth(1.5).strokeColor(TONE.abort).lineCap('round');
  doc
    .moveTo(x - size, y - size)
    .lineTo(x + size, y + size)
    .moveTo(x - size, y + size)
    .lineTo(x + size, y - size)
    .stroke();
  doc.restore();
}

/** Round tick values across [min, max], about five of them (steps of 1, 2 or 5 times a power of ten). */
function ticks(min: number, max: number): number[] {
  const rough = (max - min) / 5;
  const power = 10 ** Math.floor(Math.log10(rough));
  const step = [1, 2, 5, 10].map((factor) => factor * power).find((candidate) => candidate >= rough)!;
  const values: number[] = [];
  for (let value = Math.ceil(min / step - 1e-9) * step; value <= max + 1e-9; value += step) {
    values.push(Number(value.toFixed(10)));
  }
  return values;
}

function clamp(value: number, min: number, max: number): number {
  return Math.min(max, Math.max(min, value));
}
