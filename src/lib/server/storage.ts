import { S3_ACCESS_KEY_ID, S3_BUCKET, S3_ENDPOINT, S3_REGION, S3_SECRET_ACCESS_KEY } from 'astro:env/server';
import { createObjectStore } from './object-store';

/** The app's one store for uploaded files (sign-off photos, reference files). */
export const storage = createObjectStore({
  endpoint: S3_ENDPOINT,
  region: S3_REGION,
  bucket: S3_BUCKET,
  accessKeyId: S3_ACCESS_KEY_ID,
  secretAccessKey: S3_SECRET_ACCESS_KEY,
});
