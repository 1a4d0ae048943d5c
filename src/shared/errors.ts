/**
 * A refusal of costing or pricing input, naming each field at fault with a path in the form
 * the forms use, e.g. `{"sizes[0].lines[1].unit": "Unknown unit or measure \"pint\"."}`.
 * Thrown by the shared core for what a schema cannot see (unknown items, units and measures,
 * a missing density, a preparation cycle) as well as for values out of range.
 */
export class CostingInputError extends Error {
  constructor(readonly fields: Record<string, string>) {
    const first = Object.entries(fields)[0];
    super(first ? `${first[0]}: ${first[1]}` : 'Invalid costing input.');
    this.name = 'CostingInputError';
  }
}

/** Collects field messages (the first message for a field wins) so one refusal names them all. */
export class FieldErrors {
  readonly fields: Record<string, string> = {};

  add(path: string, message: string): void {
    if (!(path in this.fields)) this.fields[path] = message;
  }

  get any(): boolean {
    return Object.keys(this.fields).length > 0;
  }

  throwIfAny(): void {
    if (this.any) throw new CostingInputError({ ...this.fields });
  }
}
