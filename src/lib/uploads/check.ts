// Decides whether an uploaded file may be kept: its size, and its real type as read from its bytes
// (never the name or the type the browser declared). Pure, so the same rules can be unit-tested and
// shown in the browser before a byte is sent.

/** A type as found in the file's bytes (file-type's answer, or `sniffText`'s for text files). */
export interface DetectedType {
  mime: string;
  ext: string;
}

export interface AcceptedType {
  mime: string;
  /** How people name the format in a message. */
  label: string;
}

/** What one kind of upload accepts; each purpose has its own list, so reference files can add PDF. */
export interface UploadRule {
  maxBytes: number;
  types: readonly AcceptedType[];
  /** The accepted formats in words, e.g. "JPEG, PNG, WebP or HEIC". */
  formats: string;
  /** For the file input's accept attribute: the browser's picker only; the server still checks. */
  accept: string;
}

export const MB = 1024 * 1024;

const IMAGE_TYPES: readonly AcceptedType[] = [
  { mime: 'image/jpeg', label: 'JPEG' },
  { mime: 'image/png', label: 'PNG' },
  { mime: 'image/webp', label: 'WebP' },
  // Phone cameras save HEIC/HEIF; still images and the "sequence" variants (bursts, live photos) alike.
  { mime: 'image/heic', label: 'HEIC' },
  { mime: 'image/heif', label: 'HEIF' },
  { mime: 'image/heic-sequence', label: 'HEIC' },
  { mime: 'image/heif-sequence', label: 'HEIF' },
];

/** How many photos of one procedure a learner may keep: plenty for a few bench sessions, not a photo album. */
export const MAX_BENCH_PHOTOS_PER_PROCEDURE = 24;

/** A learner's photo of the finished assembly. */
export const BENCH_PHOTO_RULE: UploadRule = {
  maxBytes: 10 * MB,
  types: IMAGE_TYPES,
  formats: 'JPEG, PNG, WebP or HEIC',
  accept: 'image/jpeg,image/png,image/webp,image/heic,image/heif,.jpg,.jpeg,.png,.webp,.heic,.heif',
};

/** PDF: a spec sheet or a page of the service data an instructor may share. */
const PDF_TYPE: AcceptedType = { mime: 'application/pdf', label: 'PDF' };

/** How many reference files one procedure keeps: a spec sheet and a few photos, not a document store. */
export const MAX_REFERENCE_FILES_PER_PROCEDURE = 20;

/** A file attached to a procedure by someone who may edit it: photos as for the bench, or a PDF. */
export const PROCEDURE_REFERENCE_RULE: UploadRule = {
  maxBytes: 10 * MB,
  types: [...IMAGE_TYPES, PDF_TYPE],
  formats: 'JPEG, PNG, WebP, HEIC or PDF',
  accept: 'image/*,application/pdf,.pdf,.heic,.heif',
};

export interface UploadCandidate {
  /** What the bytes are, or null when nothing was recognised. */
  detected: DetectedType | null;
  /** The file name the browser sent; only used to word the message. */
  name: string;
  size: number;
}

export type UploadCheck =
  | { ok: true; contentType: string }
  | { ok: false; reason: 'empty' | 'too-large' | 'wrong-type'; message: string };

/** The size alone: what the browser can tell before sending a byte (the type is the server's to judge). */
export function checkSize(size: number, rule: UploadRule): Extract<UploadCheck, { ok: false }> | null {
  if (size <= 0) return { ok: false, reason: 'empty', message: 'The file is empty.' };
  if (size > rule.maxBytes) {
    return { ok: false, reason: 'too-large', message: `The file is ${formatBytes(size)}; at most ${formatBytes(rule.maxBytes)} is accepted.` };
  }
  return null;
}

export function checkUpload(file: UploadCandidate, rule: UploadRule): UploadCheck {
  const sizeProblem = checkSize(file.size, rule);
  if (sizeProblem) return sizeProblem;
  const accepted = file.detected && rule.types.find((t) => t.mime === file.detected!.mime);
  if (accepted) return { ok: true, contentType: accepted.mime };

  const ext = extensionOf(file.name);
  const named = ext ? ` although its name ends in .${ext}` : '';
  const found = file.detected ? describe(file.detected) : 'not a format we recognise';
  return {
    ok: false,
    reason: 'wrong-type',
    message: `The file's content is ${found}${named}. Upload ${rule.formats}.`,
  };
}

function describe(type: DetectedType): string {
  if (type.mime === 'image/svg+xml') return 'an SVG drawing (image/svg+xml), which is not accepted';
  if (type.mime === 'text/plain') return 'plain text (text/plain)';
  return `${type.ext.toUpperCase()} (${type.mime})`;
}

/**
 * The type to judge a file by: what file-type found from its magic number, or, for text (which has
 * none, and which file-type reports at best as generic XML), what `sniffText` finds.
 */
export function detectedType(found: DetectedType | undefined, bytes: Uint8Array): DetectedType | null {
  if (found && found.mime !== 'application/xml') return { mime: found.mime, ext: found.ext };
  return sniffText(bytes) ?? (found ? { mime: found.mime, ext: found.ext } : null);
}

/**
 * Text formats have no magic number for file-type to find. Reads the start of the bytes: SVG (refused
 * by name, since an SVG can carry script) or plain text, so a refusal can say what the file really is.
 */
export function sniffText(bytes: Uint8Array): DetectedType | null {
  const head = bytes.subarray(0, 1024);
  if (head.length === 0) return null;
  for (const b of head) {
    // Control bytes other than tab, line feed, carriage return and form feed mean binary.
    if (b < 0x20 && b !== 0x09 && b !== 0x0a && b !== 0x0d && b !== 0x0c) return null;
  }
  const text = new TextDecoder('utf-8', { fatal: false }).decode(head).toLowerCase();
  if (text.includes('<svg')) return { mime: 'image/svg+xml', ext: 'svg' };
  return { mime: 'text/plain', ext: 'txt' };
}

function extensionOf(name: string): string | null {
  const match = /\.([a-z0-9]{1,8})$/i.exec(name.trim());
  return match ? match[1]!.toLowerCase() : null;
}

/**
 * The name to show beside a stored file: the last path segment, without control characters,
 * at most 200 characters (`fallback` when nothing is left). It is never part of a storage key.
 */
export function cleanFileName(name: string, fallback = 'photo'): string {
  const base = name.split(/[\\/]/).pop() ?? '';
  // eslint-disable-next-line no-control-regex
  const cleaned = base.replace(/[\u0000-\u001f\u007f]/g, '').trim().slice(0, 200);
  return cleaned || fallback;
}

/** 10485760 → "10 MB"; 2500000 → "2.4 MB"; small files in KB. */
export function formatBytes(bytes: number): string {
  if (bytes >= MB) return `${trim(bytes / MB)} MB`;
  if (bytes >= 1024) return `${trim(bytes / 1024)} KB`;
  return `${bytes} bytes`;
}

function trim(n: number): string {
  return (Math.round(n * 10) / 10).toString();
}
