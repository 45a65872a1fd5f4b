import { type WriteStream, createWriteStream } from "node:fs";
import { once } from "node:events";

/** A text file written in batches, waiting for the disk when its buffer is full. */
export class TextSink {
  private readonly stream: WriteStream;
  private parts: string[] = [];
  private size = 0;

  constructor(readonly path: string) {
    this.stream = createWriteStream(path, { encoding: "utf8" });
  }

  async write(text: string) {
    this.parts.push(text);
    this.size += text.length;
    if (this.size > 1 << 20) await this.flush();
  }

  async flush() {
    if (!this.parts.length) return;
    const chunk = this.parts.join("");
    this.parts = [];
    this.size = 0;
    if (!this.stream.write(chunk)) await once(this.stream, "drain");
  }

  async close() {
    await this.flush();
    this.stream.end();
    await once(this.stream, "finish");
  }
}
