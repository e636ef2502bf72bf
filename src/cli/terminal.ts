/**
 * Where the CLI writes, and how: colour only on a TTY and never when NO_COLOR
 * is set (https://no-color.org, common practice); progress only on a TTY.
 */
export interface Output {
  /** Text, or bytes already encoded (read --json's S array). */
  write(chunk: string | Uint8Array): void;
  readonly isTTY?: boolean;
}

export interface Terminal {
  readonly stdout: Output;
  readonly stderr: Output;
  readonly env: Readonly<Record<string, string | undefined>>;
  readonly cwd: string;
}

export interface Painter {
  red(s: string): string;
  green(s: string): string;
  yellow(s: string): string;
  bold(s: string): string;
  dim(s: string): string;
}

const plain: Painter = { red: (s) => s, green: (s) => s, yellow: (s) => s, bold: (s) => s, dim: (s) => s };
const sgr = (code: string) => (s: string) => `\x1b[${code}m${s}\x1b[0m`;
const ansi: Painter = { red: sgr('31'), green: sgr('32'), yellow: sgr('33'), bold: sgr('1'), dim: sgr('2') };

export function colourEnabled(out: Output, env: Terminal['env']): boolean {
  return Boolean(out.isTTY) && env.NO_COLOR === undefined;
}

export function painter(out: Output, env: Terminal['env']): Painter {
  return colourEnabled(out, env) ? ansi : plain;
}
