/**
 * Calibration of raw spectra into physical units. A sensor's response H(f) is
 * its output per unit of the measured field (e.g. counts per (V/m), or V per T);
 * a flat `gain` is the frequency-independent case. Power spectra transform with
 * |H|^2: P_field(f) = P_raw(f) / |H(f)|^2 (Bendat & Piersol, Random Data,
 * §6.1: output PSD = |H|^2 x input PSD). A response table gives amplitude and
 * phase at listed frequencies; between them amplitude is interpolated linearly
 * and phase linearly after unwrapping, so H(f) is available as a complex value.
 */

export type Calibration =
  { kind: 'gain'; gain: number } | { kind: 'response'; points: { frequencyHz: number; amplitude: number; phaseDeg: number }[] };

export class CalibrationError extends Error {}

/** Check a calibration, naming the first bad entry. */
export function checkCalibration(cal: Calibration): void {
  if (cal.kind === 'gain') {
    if (!Number.isFinite(cal.gain) || cal.gain === 0)
      throw new CalibrationError(`calibration gain must be a non-zero number, got ${cal.gain}`);
    return;
  }
  if (cal.points.length < 2) throw new CalibrationError('a response table needs at least two frequencies');
  cal.points.forEach((p, i) => {
    const row = `response table row ${i + 1}`;
    if (!Number.isFinite(p.frequencyHz) || p.frequencyHz < 0)
      throw new CalibrationError(`${row}: frequencyHz must be a number >= 0, got ${p.frequencyHz}`);
    if (!Number.isFinite(p.amplitude) || p.amplitude <= 0)
      throw new CalibrationError(`${row}: amplitude must be a positive number, got ${p.amplitude}`);
    if (!Number.isFinite(p.phaseDeg)) throw new CalibrationError(`${row}: phaseDeg must be a number, got ${p.phaseDeg}`);
    if (i > 0 && !(p.frequencyHz > cal.points[i - 1].frequencyHz))
      throw new CalibrationError(`${row}: frequencies must increase (${p.frequencyHz} after ${cal.points[i - 1].frequencyHz})`);
  });
}

export interface ResponseValue {
  re: number;
  im: number;
  amplitude: number;
  phaseDeg: number;
  /** True when f lies outside the table and the nearest end value was used. */
  outside: boolean;
}

function unwrapDeg(phases: number[]): number[] {
  const out = [phases[0]];
  for (let i = 1; i < phases.length; i++) {
    let d = phases[i] - phases[i - 1];
    d -= 360 * Math.round(d / 360);
    out.push(out[i - 1] + d);
  }
  return out;
}

/** H(f) for a list of frequencies. */
export function responseAt(cal: Calibration, frequencies: ArrayLike<number>): ResponseValue[] {
  checkCalibration(cal);
  const out: ResponseValue[] = [];
  if (cal.kind === 'gain') {
    for (let k = 0; k < frequencies.length; k++) {
      const g = cal.gain;
      out.push({ re: g, im: 0, amplitude: Math.abs(g), phaseDeg: g < 0 ? 180 : 0, outside: false });
    }
    return out;
  }
  const pts = cal.points;
  const phase = unwrapDeg(pts.map((p) => p.phaseDeg));
  const last = pts.length - 1;
  let i = 0;
  for (let k = 0; k < frequencies.length; k++) {
    const f = frequencies[k];
    let amp: number,
      ph: number,
      outside = false;
    if (f <= pts[0].frequencyHz) {
      amp = pts[0].amplitude;
      ph = phase[0];
      outside = f < pts[0].frequencyHz;
    } else if (f >= pts[last].frequencyHz) {
      amp = pts[last].amplitude;
      ph = phase[last];
      outside = f > pts[last].frequencyHz;
    } else {
      if (f < pts[i].frequencyHz) i = 0;
      while (pts[i + 1].frequencyHz < f) i++;
      const t = (f - pts[i].frequencyHz) / (pts[i + 1].frequencyHz - pts[i].frequencyHz);
      amp = pts[i].amplitude + t * (pts[i + 1].amplitude - pts[i].amplitude);
      ph = phase[i] + t * (phase[i + 1] - phase[i]);
    }
    const rad = (ph * Math.PI) / 180;
    out.push({ re: amp * Math.cos(rad), im: amp * Math.sin(rad), amplitude: amp, phaseDeg: ph, outside });
  }
  return out;
}

export interface CalibratedSpectrum {
  power: Float64Array;
  /** Bins whose frequency lay outside the response table. */
  outside: number;
}

/** P_field = P_raw / |H(f)|^2 at every bin. */
export function calibrateSpectrum(
  frequencies: ArrayLike<number>,
  power: ArrayLike<number>,
  cal: Calibration,
): CalibratedSpectrum {
  const h = responseAt(cal, frequencies);
  const out = new Float64Array(power.length);
  let outside = 0;
  for (let k = 0; k < power.length; k++) {
    out[k] = power[k] / (h[k].amplitude * h[k].amplitude);
    if (h[k].outside) outside++;
  }
  return { power: out, outside };
}
