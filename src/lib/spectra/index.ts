/**
 * Public surface of the spectra core (pure: imports only field libraries).
 * Upload: parseSpectrumFile → normaliseSpectrum → deriveSpectrum; preview: inspectDelimited.
 */
export type * from './types';
export { parseSpectrumFile, type ParseFileOptions } from './parse/index';
export { parseJcamp } from './parse/jcamp';
export { parseDelimited, type DelimitedOptions } from './parse/csv';
export { inspectDelimited, type DelimitedPreview } from './parse/csvInspect';
export { normaliseSpectrum, type NormaliseOptions } from './normalise';
export { deriveSpectrum, type DeriveOptions } from './derive';
export { findPeaks, type Peak } from './peaks';
export { findAbsorptionEdge, findCutoff, findMaxIndex } from './bands';
export { resampleToGrid, gridLength } from './resample';
export { makeGrid, toSearchVector, vectorToBuffer, bufferToVector, GRID_FROM_NM, GRID_TO_NM, COMPUTE_STEP_NM, SEARCH_STEP_NM, SEARCH_LENGTH } from './grid';
export { cosineSimilarity, rankSimilar } from './similarity';
export { exportCsv } from './export/csv';
export { exportJcamp } from './export/jcamp';
export * from './units';
