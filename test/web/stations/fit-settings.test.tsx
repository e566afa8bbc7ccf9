/**
 * The station day view's description of how a stored fit was made: band in Hz,
 * K_eff, and the ranges left out, with "not recorded" for fits stored before
 * these were kept. Expected strings are written out by hand from the inputs.
 */
import { describe, expect, it } from 'vitest';
import { renderToStaticMarkup } from 'react-dom/server';
import { FitSettings, fitSettingsText, NOT_RECORDED } from '@/src/web/stations/FitSettings';

describe('fit settings text', () => {
  it('writes the band, the averages and each range left out', () => {
    const t = fitSettingsText({
      band: { minHz: 3, maxHz: 36.5 },
      averages: 112.74,
      excluded: [
        { minHz: 16.400000000000002, maxHz: 16.9 },
        { minHz: 49.5, maxHz: 49.5 },
      ],
    });
    expect(t).toEqual({ band: '3–36.5 Hz', averages: '112.7', excluded: '16.4–16.9 Hz, 49.5 Hz' });
  });

  it('tells "nothing left out" from "not recorded"', () => {
    expect(fitSettingsText({ band: { minHz: 4, maxHz: 24 }, excluded: [] }).excluded).toBe('nothing left out');
    const old = fitSettingsText({});
    expect(old.band).toBe(NOT_RECORDED);
    expect(old.excluded).toBe(NOT_RECORDED);
    expect(old.averages).toBe(NOT_RECORDED);
  });

  it('renders on the server with the three labels and the values', () => {
    const html = renderToStaticMarkup(<FitSettings fit={{ band: { minHz: 4, maxHz: 24 }, averages: 30 }} />);
    for (const s of ['Fitted band', '4–24 Hz', 'K_eff', '30.0', 'Left out of the fit', NOT_RECORDED]) expect(html).toContain(s);
  });
});
