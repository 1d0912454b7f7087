import type { StationFileSummary, StationJoinSummary, StationPairSummary } from '@shared/analysis';
import type { RunReportDto } from '@shared/api';
import { formatCount } from '@shared/format/numbers';
import { writeAbsentPart } from './pdf-absent-part';
import { fields, paragraph, type Field } from './pdf-blocks';
import { writeStationAlignment } from './pdf-station-alignment';
import { writeStationTiming } from './pdf-station-timing';
import { TONE } from './pdf-style';
import { lackingSentence, statedOffsetSentence } from './station-words';

/** Whether the report is of a run of two station logs (else one joined log). */
export function isStationPair(report: RunReportDto): boolean {
  return report.result.stations !== undefined || (report.stations ?? null) !== null;
}

/**
 * A run of two station logs: each station's file and what its record lacks, the join with the
 * offset a shift lead stated, the alignment check, then the timing check.
 */
export function writeStations(doc: PDFKit.PDFDocument, report: RunReportDto): void {
  const pair = report.result.stations;
  if (pair === undefined) {
    writeAbsentPart(doc, report.result, 'station figures');
    return;
  }
  const names = { A: report.run.originalName, B: report.stations?.stationB.originalName ?? 'name not recorded' };
  const labels = { A: report.run.stationA, B: report.run.stationB };
  fields(
    doc,
    pair.files.flatMap((file) => fileRows(file, labels[file.station], names[file.station], pair.join)),
  );
  doc.y += 3;
  writeJoin(doc, report, pair);
  writeStationAlignment(doc, pair.alignment);
  writeStationTiming(doc, pair, report.stations);
}

/** One station's file: its name, digest and contents, and what its record lacks. */
function fileRows(file: StationFileSummary, label: string, name: string, join: StationJoinSummary | null): Field[] {
  const compression = file.compression === 'gzip' ? 'gzip-compressed' : 'not compressed';
  const rounds = file.firstRound === null || file.lastRound === null ? 'no rounds' : `round indices ${formatCount(file.firstRound)}–${formatCount(file.lastRound)} as written`;
  const valid = file.rounds === file.records ? '' : `, ${formatCount(file.rounds)} of them valid`;
  const problems = file.problemCount === 0 ? '' : `; ${formatCount(file.problemCount)} ${file.problemCount === 1 ? 'problem' : 'problems'}`;
  const times = file.hasTimes ? 'with the time columns' : 'without time columns';
  return [
    { label: `Station ${file.station}, ${label}`, value: name },
    { label: '  SHA-256', value: file.sha256, mono: true },
    {
      label: '  Contents',
      value: `${formatCount(file.bytes)} bytes, ${compression}; ${formatCount(file.records)} records${valid}, ${rounds}; ${times}${problems}`,
      ...(file.problemCount > 0 ? { labelTone: TONE.threshold } : {}),
    },
    ...(join === null ? [] : [{ label: '  Lacks', value: lackingSentence(file.station, file.station === 'A' ? join.stationA : join.stationB) }]),
  ];
}

/** The join: the rounds both records hold within the span of both, the missing ones, and the offset stated. */
function writeJoin(doc: PDFKit.PDFDocument, report: RunReportDto, pair: StationPairSummary): void {
  const { join } = pair;
  if (join === null) {
    paragraph(doc, 'The logs were not joined: a station log could not be read (see the problems under the verdict).', { colour: TONE.muted });
    return;
  }
  const span =
    join.span === null ? 'no rounds' : `round indices ${formatCount(join.span.firstRound)}–${formatCount(join.span.lastRound)} (${formatCount(join.span.triggers)} triggers)`;
  const neither = join.missingFromBoth === 0 ? '' : `, ${formatCount(join.missingFromBoth)} of them held by neither record`;
  fields(doc, [
    {
      label: 'Joined',
      value: `${formatCount(join.joinedRounds)} rounds both records hold, in ${span}, numbered as station A numbers them; ${formatCount(join.missing)} missing${neither}`,
    },
    { label: 'Stated offset', value: statedOffsetSentence(pair, report.stations) ?? 'None: the records are joined as written.' },
  ]);
}
