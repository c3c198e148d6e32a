import { fileTypeFromBuffer } from 'file-type';
import { describe, expect, it } from 'vitest';
import { demoSpecCard, encodePdf } from '../../scripts/demo-pdf';
import { encodePng } from '../../scripts/demo-photo';
import {
  BENCH_PHOTO_RULE, checkUpload, cleanFileName, detectedType, formatBytes, MB, PROCEDURE_REFERENCE_RULE, type UploadRule,
} from '../../src/lib/uploads/check';

// Small files whose first bytes follow each format's specification, so file-type (what the server
// runs) and our rule are tested together on what a real camera or editor writes.

const ascii = (s: string) => [...s].map((c) => c.charCodeAt(0));
const le32 = (n: number) => [n & 0xff, (n >> 8) & 0xff, (n >> 16) & 0xff, (n >> 24) & 0xff];
const be32 = (n: number) => [(n >> 24) & 0xff, (n >> 16) & 0xff, (n >> 8) & 0xff, n & 0xff];

// JPEG: SOI marker FF D8 followed by a marker segment FF E0 (APP0) holding "JFIF\0" — ITU-T T.81 (SOI = FFD8)
// and the JFIF 1.02 specification (APP0 segment, identifier "JFIF"); ends with EOI FF D9.
const jpeg = new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0x00, 0x10, ...ascii('JFIF'), 0x00, 0x01, 0x01, 0x00, 0x00, 0x01, 0x00, 0x01, 0x00, 0x00, 0xff, 0xd9]);

// PNG: the 8-byte signature 89 50 4E 47 0D 0A 1A 0A, then IHDR … IEND — PNG specification / RFC 2083 §3.1.
const png = encodePng(2, 2, () => [200, 120, 40]);

// WebP: a RIFF container, "RIFF" + little-endian size + "WEBP", then a "VP8L" chunk — RFC 9649 §2.
const vp8l = [0x2f, 0x00, 0x00, 0x00, 0x00];
const webp = new Uint8Array([...ascii('RIFF'), ...le32(4 + 8 + vp8l.length + 1), ...ascii('WEBP'), ...ascii('VP8L'), ...le32(vp8l.length), ...vp8l, 0x00]);

// HEIF/HEIC: an ISO BMFF 'ftyp' box (size, "ftyp", major brand, minor version, compatible brands) —
// ISO/IEC 23008-12 (brands "heic", "heix" for HEVC images, "mif1" image, "msf1" image sequence).
const ftyp = (major: string, ...compatible: string[]) =>
  new Uint8Array([...be32(16 + 4 * compatible.length), ...ascii('ftyp'), ...ascii(major), 0, 0, 0, 0, ...compatible.flatMap(ascii), ...new Array(32).fill(0)]);

async function check(bytes: Uint8Array, name: string, rule: UploadRule = BENCH_PHOTO_RULE) {
  // The same two steps as the server's detectType.
  const detected = detectedType(await fileTypeFromBuffer(bytes), bytes);
  return checkUpload({ detected, name, size: bytes.byteLength }, rule);
}

describe('bench photos: the type is read from the bytes', () => {
  it('accepts JPEG, PNG and WebP with the type found in their bytes', async () => {
    expect(await check(jpeg, 'sump.jpg')).toEqual({ ok: true, contentType: 'image/jpeg' });
    expect(Array.from(png.subarray(0, 8))).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]); // RFC 2083 signature
    expect(await check(png, 'sump.png')).toEqual({ ok: true, contentType: 'image/png' });
    expect(await check(webp, 'sump.webp')).toEqual({ ok: true, contentType: 'image/webp' });
  });

  it('accepts HEIC and HEIF from phone cameras, stills and sequences', async () => {
    expect(await check(ftyp('heic', 'mif1', 'heic'), 'IMG_0042.HEIC')).toEqual({ ok: true, contentType: 'image/heic' });
    expect(await check(ftyp('heix', 'mif1'), 'a.heic')).toEqual({ ok: true, contentType: 'image/heic' });
    expect(await check(ftyp('mif1', 'heic'), 'a.heif')).toEqual({ ok: true, contentType: 'image/heif' });
    expect(await check(ftyp('msf1', 'hevc'), 'a.heic')).toEqual({ ok: true, contentType: 'image/heif-sequence' });
    expect(await check(ftyp('hevc', 'msf1'), 'a.heic')).toEqual({ ok: true, contentType: 'image/heic-sequence' });
  });

  it('goes by the bytes, not the name: a PNG called .jpg is stored as PNG', async () => {
    expect(await check(png, 'photo.jpg')).toEqual({ ok: true, contentType: 'image/png' });
  });

  it('refuses a text file named photo.jpg and says what it really is', async () => {
    const result = await check(new TextEncoder().encode('not a photo, just some notes\n'), 'photo.jpg');
    expect(result).toEqual({
      ok: false,
      reason: 'wrong-type',
      message: "The file's content is plain text (text/plain) although its name ends in .jpg. Upload JPEG, PNG, WebP or HEIC.",
    });
  });

  it('refuses SVG, even named .png (an SVG can carry script)', async () => {
    for (const text of [
      '<?xml version="1.0"?><svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>',
      '<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><rect width="10" height="10"/></svg>',
    ]) {
      const result = await check(new TextEncoder().encode(text), 'photo.png');
      expect(result.ok ? '' : result.message).toContain('an SVG drawing (image/svg+xml), which is not accepted');
    }
  });

  it('refuses other images and documents, naming the type found', async () => {
    const avif = await check(ftyp('avif', 'mif1'), 'photo.jpg');
    expect(avif.ok ? '' : avif.message).toContain('AVIF (image/avif)');
    // PDF files begin "%PDF-" (ISO 32000-1 §7.5.2, file header).
    const pdf = await check(new Uint8Array(ascii('%PDF-1.7\n%\xe2\xe3\xcf\xd3\n1 0 obj\n')), 'scan.jpeg');
    expect(pdf.ok ? '' : pdf.message).toContain('PDF (application/pdf)');
  });

  it('refuses bytes nobody recognises', async () => {
    const result = await check(new Uint8Array([0x00, 0x01, 0x02, 0x03, 0x00, 0x00, 0x7f, 0x10]), 'photo.jpg');
    expect(result).toMatchObject({ ok: false, reason: 'wrong-type' });
    expect(result.ok ? '' : result.message).toContain('not a format we recognise');
  });
});

describe('bench photos: size', () => {
  const jpegOk = { mime: 'image/jpeg', ext: 'jpg' };
  it('takes exactly the limit and refuses one byte more', () => {
    expect(checkUpload({ detected: jpegOk, name: 'a.jpg', size: 10 * MB }, BENCH_PHOTO_RULE).ok).toBe(true);
    expect(checkUpload({ detected: jpegOk, name: 'a.jpg', size: 10 * MB + 1 }, BENCH_PHOTO_RULE)).toEqual({
      ok: false,
      reason: 'too-large',
      message: 'The file is 10 MB; at most 10 MB is accepted.',
    });
    expect(checkUpload({ detected: jpegOk, name: 'a.jpg', size: 25 * MB }, BENCH_PHOTO_RULE)).toMatchObject({ reason: 'too-large' });
  });

  it('refuses an empty file', () => {
    expect(checkUpload({ detected: null, name: 'a.jpg', size: 0 }, BENCH_PHOTO_RULE)).toMatchObject({ ok: false, reason: 'empty' });
  });
});

describe('rules per purpose', () => {
  it('a rule that lists PDF accepts it: the same check serves reference files', async () => {
    const withPdf: UploadRule = {
      ...BENCH_PHOTO_RULE,
      types: [...BENCH_PHOTO_RULE.types, { mime: 'application/pdf', label: 'PDF' }],
      formats: 'an image or a PDF',
    };
    const pdf = new Uint8Array(ascii('%PDF-1.7\n%\xe2\xe3\xcf\xd3\n'));
    expect(await check(pdf, 'manual.pdf', withPdf)).toEqual({ ok: true, contentType: 'application/pdf' });
    expect((await check(pdf, 'manual.pdf')).ok).toBe(false);
  });
});

describe('reference files: bench photo types plus PDF', () => {
  const ref = (bytes: Uint8Array, name: string) => check(bytes, name, PROCEDURE_REFERENCE_RULE);
  // A PDF file begins with the header "%PDF-" and a version (ISO 32000-1:2008 §7.5.2, file header).
  const minimalPdf = new Uint8Array(ascii('%PDF-1.4\n%\xe2\xe3\xcf\xd3\n1 0 obj\n<< /Type /Catalog >>\nendobj\n%%EOF\n'));

  it('accepts a PDF, a generated spec card, and every photo a bench photo may be', async () => {
    expect(await ref(minimalPdf, 'spec.pdf')).toEqual({ ok: true, contentType: 'application/pdf' });
    expect(await ref(demoSpecCard(), 'wren-160-sump-spec-card.pdf')).toEqual({ ok: true, contentType: 'application/pdf' });
    expect(await ref(encodePdf([{ text: 'x' }], 't'), 'no-extension')).toEqual({ ok: true, contentType: 'application/pdf' });
    expect(await ref(jpeg, 'bench.jpg')).toEqual({ ok: true, contentType: 'image/jpeg' });
    expect(await ref(png, 'bench.png')).toEqual({ ok: true, contentType: 'image/png' });
    expect(await ref(webp, 'bench.webp')).toEqual({ ok: true, contentType: 'image/webp' });
    expect(await ref(ftyp('heic', 'mif1', 'heic'), 'IMG_0042.HEIC')).toEqual({ ok: true, contentType: 'image/heic' });
  });

  it('goes by the bytes: a PNG named spec.pdf is kept as a PNG', async () => {
    expect(await ref(png, 'spec.pdf')).toEqual({ ok: true, contentType: 'image/png' });
  });

  it('refuses a text file named spec.pdf, naming what it really is', async () => {
    const result = await ref(new TextEncoder().encode('Torque 11 N·m, two passes.\n'), 'spec.pdf');
    expect(result).toEqual({
      ok: false,
      reason: 'wrong-type',
      message: "The file's content is plain text (text/plain) although its name ends in .pdf. Upload JPEG, PNG, WebP, HEIC or PDF.",
    });
  });

  it('refuses SVG (it can carry script) and PostScript, even named .pdf', async () => {
    const svg = await ref(new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'), 'spec.pdf');
    expect(svg.ok ? '' : svg.message).toContain('an SVG drawing (image/svg+xml), which is not accepted');
    // PostScript begins "%!PS" (Adobe PostScript Language Reference, 3rd ed., Document Structuring Conventions header), not "%PDF-".
    const ps = await ref(new Uint8Array(ascii('%!PS-Adobe-3.0\n%%Pages: 1\nshowpage\n')), 'spec.pdf');
    expect(ps).toMatchObject({ ok: false, reason: 'wrong-type' });
  });

  it('has the bench photo size limit: exactly 10 MB is taken, one byte more refused', () => {
    const pdf = { mime: 'application/pdf', ext: 'pdf' };
    expect(checkUpload({ detected: pdf, name: 'a.pdf', size: 10 * MB }, PROCEDURE_REFERENCE_RULE).ok).toBe(true);
    expect(checkUpload({ detected: pdf, name: 'a.pdf', size: 10 * MB + 1 }, PROCEDURE_REFERENCE_RULE)).toMatchObject({ ok: false, reason: 'too-large' });
    expect(checkUpload({ detected: null, name: 'a.pdf', size: 0 }, PROCEDURE_REFERENCE_RULE)).toMatchObject({ ok: false, reason: 'empty' });
  });

  it('keeps PDF away from bench photos', async () => {
    expect(await check(minimalPdf, 'spec.pdf')).toMatchObject({ ok: false, reason: 'wrong-type' });
  });
});

describe('names and sizes in words', () => {
  it('keeps only the last path segment, without control characters', () => {
    expect(cleanFileName('C:\\Users\\ava\\Pictures\\sump.jpg')).toBe('sump.jpg');
    expect(cleanFileName('../../etc/passwd')).toBe('passwd');
    expect(cleanFileName('bad\u0000\nname.png')).toBe('badname.png');
    expect(cleanFileName('')).toBe('photo');
    expect(cleanFileName('/', 'file')).toBe('file');
    expect(cleanFileName('x'.repeat(300) + '.jpg')).toHaveLength(200);
  });

  it('formats sizes with binary units', () => {
    expect(formatBytes(10 * MB)).toBe('10 MB');
    expect(formatBytes(2_500_000)).toBe('2.4 MB'); // 2 500 000 / 1 048 576 = 2.38…
    expect(formatBytes(1536)).toBe('1.5 KB');
    expect(formatBytes(900)).toBe('900 bytes');
  });
});
