/**
 * A case file for `invert` as the one interval problem it describes: observed
 * spectra (`observed`, spectrum-input.ts) or observed mode parameters
 * (`observedModes`, mode-input.ts).
 */
import type { IntervalInput } from '@/src/engine/inverse/interval-problem';
import { caseModes, modeInputFromCase } from './mode-input';
import type { CaseFile } from './schema';
import { inputFromCase } from './spectrum-input';

export function intervalInputFromCase(c: CaseFile): IntervalInput {
  return caseModes(c) ? { kind: 'modes', input: modeInputFromCase(c) } : { kind: 'spectrum', input: inputFromCase(c) };
}
