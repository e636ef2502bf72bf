/**
 * S-parameter names in the trade's notation: S21 is the wave into port 2 from
 * port 1 (row 2, column 1 of S). Ports above 9 need a comma between the two
 * port numbers, S10,12; the comma may also be written for small ports (S2,1).
 * Mixed-mode parameters name the modes first: Sdd21 (differential out of
 * mixed-mode port 2 for differential into port 1), Scd21, Sdc21, Scc21.
 */
export interface SParameter {
  /** Receiving port, 1-based (a mixed-mode port when `mode` is set). */
  readonly to: number;
  /** Driving port, 1-based. */
  readonly from: number;
  /** Mixed-mode parameters: output mode then input mode, d (differential) or c (common), as in Sdc21. */
  readonly mode?: 'dd' | 'dc' | 'cd' | 'cc';
}

export type ParameterResult = { ok: true; value: SParameter } | { ok: false; message: string };

export function parseParameter(text: string): ParameterResult {
  const t = text.trim();
  const mm = /^S([dc])([dc])(\d)(\d)$/i.exec(t) ?? /^S([dc])([dc])(\d+),(\d+)$/i.exec(t);
  if (mm) {
    const to = Number(mm[3]),
      from = Number(mm[4]);
    if (to < 1 || from < 1) return { ok: false, message: `"${text}": ports are numbered from 1` };
    return { ok: true, value: { to, from, mode: `${mm[1].toLowerCase()}${mm[2].toLowerCase()}` as SParameter['mode'] } };
  }
  let m = /^S(\d)(\d)$/i.exec(t);
  if (!m) m = /^S(\d+),(\d+)$/i.exec(t);
  if (m) {
    const to = Number(m[1]),
      from = Number(m[2]);
    if (to >= 1 && from >= 1) return { ok: true, value: { to, from } };
    return { ok: false, message: `"${text}": ports are numbered from 1` };
  }
  if (/^S\(\s*\d+\s*,\s*\d+\s*\)$/i.test(t)) return { ok: false, message: `"${text}": write S-parameters without brackets, e.g. S10,12 or S21` };
  if (/^S\d{3,}$/i.test(t))
    return { ok: false, message: `"${text}" is ambiguous: for ports above 9 put a comma between the two port numbers (S10,2 or S1,02)` };
  return { ok: false, message: `"${text}" is not an S-parameter; expected S<to><from> such as S21 (into port 2 from port 1), or S10,12 for ports above 9` };
}

/** The canonical name: S21, S10,12 when a port is above 9, Sdd21 for mixed-mode. */
export function parameterName(p: SParameter): string {
  const ports = p.to > 9 || p.from > 9 ? `${p.to},${p.from}` : `${p.to}${p.from}`;
  return `S${p.mode ?? ''}${ports}`;
}
