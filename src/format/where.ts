/** `FILE:LINE:COL`, `FILE:LINE` without a column, or `FILE` alone for what concerns a whole file (line 0): how every message says where. */
export const whereOf = (file: string, line: number, column?: number): string => (line > 0 ? `${file}:${line}${column ? `:${column}` : ''}` : file);
