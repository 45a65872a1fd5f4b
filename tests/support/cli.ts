// Runs a CLI command in this process and returns what it wrote to stdout.
import { vi } from "vitest";

export async function captureStdout(run: () => Promise<void>): Promise<string> {
  let out = "";
  const spy = vi.spyOn(process.stdout, "write").mockImplementation((chunk: string | Uint8Array) => {
    out += String(chunk);
    return true;
  });
  try {
    await run();
  } finally {
    spy.mockRestore();
  }
  return out;
}
