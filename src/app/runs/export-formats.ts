import { EXPORT_FORMATS, type ExportFormat } from '@shared/api';

/** Each export of a run in words, as the export menu and the trail name it. */
export const EXPORT_FORMAT_LABELS: Readonly<Record<ExportFormat, string>> = {
  json: 'JSON report',
  'counts.csv': 'Counts CSV',
  'blocks.csv': 'Blocks CSV',
  pdf: 'PDF report',
};

/** The order of the export menu: the signed report first, the printable one last. */
export const EXPORT_MENU_ORDER: readonly ExportFormat[] = ['json', 'counts.csv', 'blocks.csv', 'pdf'];

/** Whether `value` names an export format. */
export function isExportFormat(value: unknown): value is ExportFormat {
  return typeof value === 'string' && (EXPORT_FORMATS as readonly string[]).includes(value);
}
