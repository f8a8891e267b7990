// What a command may touch of the outside world; only cli/main.ts binds it to `process`.

export interface OutStream {
  write(chunk: string | Uint8Array): unknown;
  isTTY?: boolean;
  columns?: number;
}

export interface CliIO {
  stdout: OutStream;
  stderr: OutStream;
  stdin: NodeJS.ReadableStream;
  env: Record<string, string | undefined>;
  cwd: string;
}

/** Colour only on a terminal and never when NO_COLOR is set (https://no-color.org). */
export function useColor(io: CliIO, stream: OutStream = io.stdout): boolean {
  const noColor = io.env.NO_COLOR;
  return stream.isTTY === true && (noColor === undefined || noColor === '') && io.env.TERM !== 'dumb';
}
