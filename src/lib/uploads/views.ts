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
