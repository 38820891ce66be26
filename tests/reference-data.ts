// Outside reference data (test vectors, a drum performance, annotated recordings) lives in ../shared beside the
// clone, never in this repository (its licences forbid copying). Tests that read it run where it exists and are
// skipped, with the reason in their title, where it does not.
import fs from 'node:fs';
import path from 'node:path';

export const REFERENCE_DATA = path.resolve(__dirname, '../../shared/reference-data');
export const hasReferenceData = fs.existsSync(REFERENCE_DATA);

/** `describe` where ../shared/reference-data exists; a skipped block that says why where it does not. */
export function describeWithReferenceData(title: string, body: () => void): void {
  if (hasReferenceData) describe(title, body);
  else describe.skip(`${title} (skipped: ../shared/reference-data is not beside this clone)`, body);
}
