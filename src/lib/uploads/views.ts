// The JSON shapes the upload and sign-off endpoints answer, shared with the islands that show them.
import type { SignOffOutcome } from '../schemas/sign-offs';

export interface BenchPhotoJson {
  id: string;
  originalName: string;
  contentType: string;
  sizeBytes: number;
  createdAt: string;
  /** The procedure's slug. */
  procedure: string | null;
  /** Part of a sign-off: kept for good, no longer deletable. */
  attached: boolean;
}

/** A file attached to a procedure (a spec sheet, a reference photo), as listed to anyone signed in. */
/** The longest caption a reference file takes (characters). */
export const CAPTION_MAX = 120;

export interface ReferenceFileJson {
  id: string;
  /** The procedure's slug. */
  procedure: string;
  originalName: string;
  /** What the file shows, in the author's words; null: the file name stands in. */
  caption: string | null;
  contentType: string;
  sizeBytes: number;
  createdAt: string;
}

export interface SignOffPhotoJson {
  id: string;
  originalName: string;
  contentType: string;
}

export interface SignOffJson {
  id: string;
  classId: string;
  className: string;
  learnerId: string;
  learnerName: string;
  procedure: string;
  procedureTitle: string;
  instructorName: string;
  benchDate: string;
  outcome: SignOffOutcome;
  notes: string;
  photos: SignOffPhotoJson[];
  createdAt: string;
}

/** Where the app serves an upload's bytes (to those who may see it). */
export const uploadUrl = (id: string) => `/api/uploads/${id}`;

/** Browsers other than Safari cannot draw HEIC/HEIF, so those are offered as a link instead of a picture. */
export const browserCanShow = (contentType: string) => !contentType.startsWith('image/hei');

/** How a reference file is labelled in a list: what a person expects to open. */
export const fileKindLabel = (contentType: string) => (contentType === 'application/pdf' ? 'PDF' : 'Photo');
