// A one-page PDF written in code, for the demo's spec card and for tests that attach a PDF. Layout per
// ISO 32000-1:2008: the header "%PDF-1.4" and a comment of four bytes over 127 (§7.5.2), indirect objects
// (§7.3.10), a cross-reference table of 20-byte entries (§7.5.4), and the trailer, startxref and %%EOF
// (§7.5.5). Text is set in Helvetica, one of the standard 14 fonts a reader always has (§9.6.2.2).

export interface PdfLine {
  text: string;
  /** Point size; 11 unless given. */
  size?: number;
  bold?: boolean;
  /** Extra space above the line, in points. */
  gap?: number;
}

const PAGE = { width: 595, height: 842 }; // A4 in points
const MARGIN = 56;

/**
 * A string for a content stream in WinAnsiEncoding: \, ( and ) escaped (§7.3.4.2), characters above
 * ASCII as octal escapes when WinAnsi has them at their Latin-1 position, "?" otherwise. The stream
 * stays plain ASCII, so its length in characters is its length in bytes.
 */
function pdfString(text: string): string {
  let out = '';
  for (const ch of text) {
    const code = ch.codePointAt(0)!;
    if (ch === '\\' || ch === '(' || ch === ')') out += `\\${ch}`;
    else if (code >= 0x20 && code < 0x7f) out += ch;
    else if (code >= 0xa0 && code <= 0xff) out += `\\${code.toString(8)}`;
    else out += '?';
  }
  return `(${out})`;
}

/** A PDF of one A4 page with the lines set top to bottom; `title` goes into the document information. */
export function encodePdf(lines: PdfLine[], title: string): Uint8Array {
  let y = PAGE.height - MARGIN;
  const ops = lines.map((line) => {
    const size = line.size ?? 11;
    y -= (line.gap ?? 0) + size * 1.4;
    return `BT /${line.bold ? 'F2' : 'F1'} ${size} Tf ${MARGIN} ${y.toFixed(1)} Td ${pdfString(line.text)} Tj ET`;
  });
  const content = ops.join('\n');

  const objects = [
    '<< /Type /Catalog /Pages 2 0 R >>',
    '<< /Type /Pages /Kids [3 0 R] /Count 1 >>',
    `<< /Type /Page /Parent 2 0 R /MediaBox [0 0 ${PAGE.width} ${PAGE.height}] /Resources << /Font << /F1 5 0 R /F2 6 0 R >> >> /Contents 4 0 R >>`,
    `<< /Length ${content.length} >>\nstream\n${content}\nendstream`,
    '<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica /Encoding /WinAnsiEncoding >>',
    '<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica-Bold /Encoding /WinAnsiEncoding >>',
    `<< /Title ${pdfString(title)} /Producer (Benchwright) >>`,
  ];

  // Latin-1 throughout: one character is one byte, so string lengths are byte offsets.
  let pdf = '%PDF-1.4\n%\xe2\xe3\xcf\xd3\n';
  const offsets: number[] = [];
  objects.forEach((body, i) => {
    offsets.push(pdf.length);
    pdf += `${i + 1} 0 obj\n${body}\nendobj\n`;
  });
  const xref = pdf.length;
  pdf += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n`;
  for (const offset of offsets) pdf += `${String(offset).padStart(10, '0')} 00000 n \n`;
  pdf += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R /Info ${objects.length} 0 R >>\nstartxref\n${xref}\n%%EOF\n`;
  return new Uint8Array(Buffer.from(pdf, 'latin1'));
}

/** The demo's spec card for the sump job: every number a demo value for the fictional Wren 160. */
export function demoSpecCard(): Uint8Array {
  return encodePdf(
    [
      { text: 'Wren 160: sump installation, spec card', size: 18, bold: true },
      { text: 'DEMO VALUES for a fictional engine, for practice only.', bold: true, gap: 6 },
      { text: "Real work uses the engine maker's service data, local codes and licensed practice." },
      { text: 'Oil seal: check the lip before fitting; replace if torn or hardened.', gap: 12 },
      { text: 'Dowel pins: two 8 mm pins. The 10 mm pin in the kit is a decoy.' },
      { text: 'Gasket: always a new sump gasket.' },
      { text: 'Assembly lube: cam gear teeth and bearing surfaces.' },
      { text: 'Timing marks: crank gear mark lined up with the cam gear mark.' },
      { text: 'Seat the sump while turning the crankshaft; never force it.' },
      { text: 'Flange bolts: 8, started by hand.' },
      { text: 'Tightening: cross pattern, 2 passes (half the spec, then the full spec).' },
      { text: 'Torque: 11 N·m (about 97 in·lbf).', bold: true },
      { text: 'Final check: 8 of 8 bolts; two crankshaft revolutions without binding.' },
      { text: 'Cautions', bold: true, size: 13, gap: 12 },
      { text: 'Disconnect and ground the spark plug lead. Work on a cool engine. Wear eye protection.' },
      { text: 'Keep solvents, oil and rags away from ignition sources; dispose of them under local rules.' },
    ],
    'Wren 160 sump spec card (demo values)',
  );
}
