/** One field's change, as the trail keeps it. */
export interface FieldChange {
  from: unknown;
  to: unknown;
}

/**
 * The fields of `after` whose values differ from `before` (compared as JSON, so arrays compare by
 * content), each with both values: what a change line of the trail shows, field by field.
 */
export function fieldChanges<T extends object>(before: T, after: Partial<T>): Record<string, FieldChange> {
  const changes: Record<string, FieldChange> = {};
  for (const [field, value] of Object.entries(after) as [keyof T & string, unknown][]) {
    if (value !== undefined && JSON.stringify(before[field]) !== JSON.stringify(value)) changes[field] = { from: before[field], to: value };
  }
  return changes;
}
