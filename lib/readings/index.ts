/**
 * Trailbench readings: the one parser and validator for logger CSV and typed-in readings,
 * shared by the browser (module worker) and the server route. Pure TypeScript: no node:
 * imports, no DOM-only APIs. See README.md.
 */
export * from './types';
export { decodeCsvBytes, checkText } from './decode';
export { parseNumberCell, parseClockCell, parseElapsedCell, formatElapsed, type ClockTime } from './cells';
export { inspectText, detectDelimiter, guessColumn, DELIMITERS, type ColumnInfo, type CsvInspection, type Delimiter } from './columns';
export { inspectCsv, parseReadings, type ParseOptions } from './parse';
export { typedReadings, FIELD_NAMES, type TypedReading, type TypedOptions } from './typed';
export { encodeSeries, decodeSeries, bytesToBase64, base64ToBytes, type DecodeResult } from './encoding';
export { downsample, CHART_POINTS } from './downsample';
export { columnSelectionSchema, readingsParseRequestSchema, typedReadingsSchema, type ReadingsParseRequest, type TypedReadingsInput } from './schemas';
