-- Statistics for the spectra stored before they were kept (db/schema/stations.ts SpectrumStatistics), each
-- marked with its basis so that nothing is mixed silently. Empty spectra (no usable segment) stay without.
-- K_eff of K contiguous Hann segments at 50 % overlap: K / (1 + 2 (1 - 1/K) rho^2), rho = 1/6 (Welch 1967,
-- IEEE Trans. Audio Electroacoust. 15, 70; Harris 1978, Proc. IEEE 66, 51), as src/engine/stats/welch-statistics.ts.

-- Synthetic spectra: made with independent log-normal scatter of sigma 1/sqrt(K) per bin.
UPDATE "interval_spectra" AS s
SET "statistics" = jsonb_build_object('basis', 'log-normal', 'sigmaLog', 1.0 / sqrt(s."segments"::float8))
FROM "intervals" AS i
WHERE i."id" = s."interval_id" AND s."statistics" IS NULL AND s."segments" > 0 AND i."origin" = 'synthetic';
--> statement-breakpoint
-- Spectrum files: they carry no statistics; the pipeline's segments over the interval are assumed (as their fits assume).
UPDATE "interval_spectra" AS s
SET "statistics" = jsonb_build_object(
  'basis', 'assumed',
  'welch', jsonb_build_object(
    'segments', s."segments", 'window', 'hann', 'overlap', 0.5,
    'effectiveAverages', s."segments"::float8 / (1 + 2 * (1 - 1.0 / s."segments") / 36.0)))
FROM "intervals" AS i
JOIN "uploads" AS u ON u."id" = i."upload_id"
WHERE i."id" = s."interval_id" AND s."statistics" IS NULL AND s."segments" > 0 AND u."format" = 'spectra-csv';
--> statement-breakpoint
-- Spectra of samples (uploads of series, pushes): the stored count of segments actually averaged, taken as
-- contiguous (the smallest K_eff for that count, so errors are not understated).
UPDATE "interval_spectra" AS s
SET "statistics" = jsonb_build_object(
  'basis', 'from-count',
  'welch', jsonb_build_object(
    'segments', s."segments", 'window', 'hann', 'overlap', 0.5,
    'effectiveAverages', s."segments"::float8 / (1 + 2 * (1 - 1.0 / s."segments") / 36.0)))
WHERE s."statistics" IS NULL AND s."segments" > 0;
