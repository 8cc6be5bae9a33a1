/** Offsets → 1-based line/column, and small helpers on the source text. */

export class LineIndex {
  private readonly starts: number[] = [0];

  constructor(readonly text: string) {
    for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) === 10) this.starts.push(i + 1);
  }

  /** 1-based line and column of a 0-based offset (clamped to the text). */
  position(offset: number): { line: number; column: number } {
    const o = Math.max(0, Math.min(offset, this.text.length));
    let lo = 0;
    let hi = this.starts.length - 1;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (this.starts[mid] <= o) lo = mid;
      else hi = mid - 1;
    }
    return { line: lo + 1, column: o - this.starts[lo] + 1 };
  }

  lineStart(offset: number): number {
    return this.starts[this.position(offset).line - 1];
  }
}

/** UTF-8 byte length without allocating an encoded copy. */
export function utf8Length(text: string): number {
  let bytes = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c < 0x80) bytes += 1;
    else if (c < 0x800) bytes += 2;
    else if (c >= 0xd800 && c <= 0xdbff && i + 1 < text.length) {
      bytes += 4;
      i++;
    } else bytes += 3;
  }
  return bytes;
}

/** A YAML path segment: `.key` for plain names, `["…"]` otherwise. */
export function childPath(path: string, key: string): string {
  const plain = /^[A-Za-z_][A-Za-z0-9_-]*$/.test(key);
  const segment = plain ? key : `[${JSON.stringify(key)}]`;
  if (path === "") return plain ? key : segment;
  return plain ? `${path}.${key}` : `${path}${segment}`;
}

export function indexPath(path: string, index: number): string {
  return `${path}[${index}]`;
}
