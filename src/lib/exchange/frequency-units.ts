// Frequency units of a measured file's first column, apart from the CSV reader so the upload
// form can list them before the reader (papaparse, zod) is loaded.
export const FREQUENCY_UNITS = { Hz: 1, kHz: 1e3, MHz: 1e6, GHz: 1e9 } as const;
export type FrequencyUnit = keyof typeof FREQUENCY_UNITS;
