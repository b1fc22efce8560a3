import { fileTypeFromBuffer } from 'file-type';
import sharp from 'sharp';
import { assertImagePixels, MAX_IMAGE_PIXELS } from '../../lib/uploads';

/** Image types a photo may be, judged by the file's first bytes (never its name or the browser's claim). */
export const ACCEPTED_IMAGE_MIME = ['image/jpeg', 'image/png', 'image/webp'] as const;
export const PHOTO_MAX_BYTES = 15 * 1024 * 1024;
const FULL_MAX_PX = 2048;
const THUMB_MAX_PX = 320;

export class ImageRejected extends Error {
  constructor(
    readonly code: 'not_an_image' | 'unreadable_image',
    message: string,
  ) {
    super(message);
  }
}

export type ProcessedImage = {
  mime: string;
  full: Buffer;
  thumb: Buffer;
  widthPx: number;
  heightPx: number;
};

/**
 * Checks the bytes are a JPEG, PNG or WebP image, then writes an upright JPEG (EXIF orientation
 * applied, metadata such as GPS dropped) no larger than 2048 px and a 320 px thumbnail.
 */
export async function processPhoto(bytes: Buffer): Promise<ProcessedImage> {
  const type = await fileTypeFromBuffer(bytes);
  if (!type || !(ACCEPTED_IMAGE_MIME as readonly string[]).includes(type.mime)) {
    const found = type ? `${type.ext} file` : 'file whose content is not an image';
    throw new ImageRejected('not_an_image', `That is a ${found}. Upload a photo (JPEG, PNG or WebP).`);
  }
  await assertImagePixels(bytes, MAX_IMAGE_PIXELS.photo, 'photo');
  try {
    // rotate() with no angle turns the pixels upright from the EXIF orientation tag.
    const upright = sharp(bytes, { failOn: 'error' }).rotate();
    const full = await upright
      .clone()
      .resize({ width: FULL_MAX_PX, height: FULL_MAX_PX, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 85, mozjpeg: true })
      .toBuffer({ resolveWithObject: true });
    const thumb = await upright
      .clone()
      .resize({ width: THUMB_MAX_PX, height: THUMB_MAX_PX, fit: 'inside', withoutEnlargement: true })
      .jpeg({ quality: 75 })
      .toBuffer();
    return { mime: 'image/jpeg', full: full.data, thumb, widthPx: full.info.width, heightPx: full.info.height };
  } catch {
    throw new ImageRejected('unreadable_image', 'The photo could not be read; it may be damaged. Take it again or pick another file.');
  }
}
