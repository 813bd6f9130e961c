// The result-file parser's public surface.
export { parseResultFile, type ParseOptions } from './parse-result-file.ts';
export {
  FileLayoutError,
  type ColumnRole,
  type Issue,
  type ParsedBurn,
  type ParsedFile,
  type ParsedSample,
  type ParsedValue,
} from './types.ts';
export { HEADER_ALIASES } from './header-aliases.ts';
