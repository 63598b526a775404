export type WorkingUnit = 'mmHg' | 'm' | 'kg' | 'L/min' | 'fraction' | '%';

/** One checkable step of a computation: a consultant can redo each line by hand from the lines above it. */
export interface WorkingLine {
  key: string;
  label: string;
  value: number | null;
  unit: WorkingUnit;
  formula: string;
  source: string;
}

/** Collects lines in the order they are computed, so the list reads top to bottom like a worked sheet. */
export class WorkingSheet {
  private readonly lines: WorkingLine[] = [];

  add(line: WorkingLine): number | null {
    if (this.lines.some((existing) => existing.key === line.key)) {
      throw new Error(`Working line ${line.key} added twice`);
    }
    this.lines.push(line);
    return line.value;
  }

  toArray(): WorkingLine[] {
    return this.lines.map((line) => ({ ...line }));
  }
}
