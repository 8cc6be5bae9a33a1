import { describe, it, expect } from "vitest";
import { createHash } from "node:crypto";
import { sha256, sha256Hex } from "../../../lib/screening/spec";

// Test vectors: NIST FIPS 180-2 (2002), Appendix B.1 ("abc"), B.2 (the 448-bit message) and
// B.3 (one million 'a'), digests as printed there (from memory). The empty-message digest is not
// in FIPS 180-2 itself: it is the widely published value (from memory), and the last test checks
// it, with many other lengths, against node:crypto as an independent reference implementation.
describe("sha256 (FIPS 180-2 test vectors)", () => {
  it('digests "abc" (FIPS 180-2 Appendix B.1)', () => {
    expect(sha256Hex("abc")).toBe("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad");
  });

  it("digests the empty message", () => {
    expect(sha256Hex("")).toBe("e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855");
  });

  it("digests the 448-bit two-block message (FIPS 180-2 Appendix B.2)", () => {
    expect(sha256Hex("abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq")).toBe(
      "248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1",
    );
  });

  it("digests one million 'a' (FIPS 180-2 Appendix B.3)", () => {
    expect(sha256Hex("a".repeat(1_000_000))).toBe("cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0");
  });

  it("agrees with node:crypto (reference implementation) at every padding boundary and on UTF-8 text", () => {
    const lengths = [0, 1, 3, 54, 55, 56, 57, 63, 64, 65, 119, 120, 127, 128, 129, 1000];
    for (const n of lengths) {
      const bytes = new Uint8Array(n).map((_, i) => (i * 131 + n) & 0xff);
      const ours = Buffer.from(sha256(bytes)).toString("hex");
      expect(ours, `length ${n}`).toBe(createHash("sha256").update(bytes).digest("hex"));
    }
    const text = "i u_t + a u_xx + h|u|^2 u = 0 — Schrödinger, ψ, 𝜓";
    expect(sha256Hex(text)).toBe(createHash("sha256").update(text, "utf8").digest("hex"));
  });
});
