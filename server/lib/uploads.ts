import type { NextFunction, Request, Response } from 'express';
import multer from 'multer';
import sharp from 'sharp';
import { AppError, fieldError } from './errors';

/**
 * Most pixels an uploaded image may have, by kind. The bytes are capped separately; these cap what
 * decoding costs (a small, highly compressed PNG can claim 60,000 × 60,000 pixels: 14 GB decoded).
 * Photos are downscaled on the server (phone cameras reach 50 MP); underlays are decoded by the
 * browser at full size (an A1 scan at 200 dpi is about 30 MP); logos are drawn into PDFs.
 */
export const MAX_IMAGE_PIXELS = { photo: 100_000_000, underlay: 40_000_000, logo: 4_000_000 } as const;

// eslint-disable-next-line no-control-regex -- finding control characters is the point
const CONTROL_CHARS = /[\u0000-\u001f\u007f]/;

/**
 * multer in memory for one file in `field`, at most `maxBytes`. Every way an upload can be wrong
 * becomes a clear 4xx: too large (413 `<code>`), another field or several files (422 naming the
 * field), a file name with control characters such as NUL (422; it could not be stored or shown),
 * a broken multipart body (400).
 */
export function receiveFile(opts: { field: string; maxBytes: number; tooLarge: { code: string; message: string }; fields?: number; fieldSize?: number }) {
  const upload = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: opts.maxBytes, files: 1, fields: opts.fields ?? 5, ...(opts.fieldSize ? { fieldSize: opts.fieldSize } : {}) },
  }).single(opts.field);
  return (req: Request, res: Response, next: NextFunction) => {
    upload(req, res, (err: unknown) => {
      if (err instanceof multer.MulterError) {
        if (err.code === 'LIMIT_FILE_SIZE') return next(new AppError(413, opts.tooLarge.code, opts.tooLarge.message));
        if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT')
          return next(fieldError(opts.field, `send one file, in the field "${opts.field}"`));
        return next(new AppError(400, 'bad_upload', err.message));
      }
      if (err) return next(new AppError(400, 'bad_upload', `the upload could not be read: ${(err as Error).message ?? 'malformed form data'}`));
      if (req.file && CONTROL_CHARS.test(req.file.originalname))
        return next(fieldError(opts.field, 'the file name contains control characters (such as a NUL byte); rename the file and upload it again'));
      next();
    });
  };
}

/**
 * Refuses an image with more pixels than `maxPixels` (413 `image_too_many_pixels`), reading only
 * its header (sharp's metadata), before anything decodes it. 415 when the header cannot be read.
 */
export async function assertImagePixels(bytes: Buffer, maxPixels: number, what: string): Promise<{ width: number; height: number }> {
  let meta: Awaited<ReturnType<ReturnType<typeof sharp>['metadata']>>;
  try {
    meta = await sharp(bytes, { limitInputPixels: false }).metadata();
  } catch {
    throw new AppError(415, 'unreadable_image', `the ${what} could not be read as an image; it may be damaged`);
  }
  const width = meta.width ?? 0;
  const height = meta.height ?? 0;
  if (!width || !height) throw new AppError(415, 'unreadable_image', `the ${what} has no size in its header; it may be damaged`);
  if (width * height > maxPixels) {
    throw new AppError(
      413,
      'image_too_many_pixels',
      `the ${what} is ${width.toLocaleString('en-GB')} × ${height.toLocaleString('en-GB')} pixels; at most ${(maxPixels / 1e6).toLocaleString('en-GB')} megapixels are accepted: scale it down and upload it again`,
    );
  }
  return { width, height };
}
