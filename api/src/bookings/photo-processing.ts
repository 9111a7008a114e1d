import sharp, { type Sharp } from 'sharp';

/** A phone's full-size photo is 12–50 megapixels; beyond this a file is a decompression bomb, not a photo. */
export const MAX_PHOTO_PIXELS = 60_000_000;
/** The long edge the stored photo keeps: ample to read a label on a pedal, far from a camera's full size. */
export const PHOTO_LONG_EDGE = 3000;
/** The long edge of the copy shown in photo lists. */
export const THUMBNAIL_LONG_EDGE = 480;

export type PhotoFormat = 'image/jpeg' | 'image/png' | 'image/webp';

export interface EncodedImage {
  bytes: Buffer;
  contentType: string;
  ext: string;
}

export interface ProcessedPhoto {
  full: EncodedImage;
  thumbnail: EncodedImage;
  width: number;
  height: number;
}

/** The photo's bytes cannot be turned into pixels; the message says why in words. */
export class UnreadablePhotoError extends Error {}

/**
 * Re-encodes an uploaded photo so that nothing of the uploaded file but its pixels goes back out.
 *
 * The pipeline turns the image upright first (by its EXIF Orientation, which is then dropped with
 * the rest), then writes fresh bytes: sharp keeps no metadata unless asked to (no EXIF, so no GPS
 * position, camera serial or time; no XMP, no ICC profile — the pixels are converted to sRGB
 * instead). Whatever else the uploaded file carried (trailing bytes, a second embedded file,
 * comments) is not part of the decoded pixels, so it cannot survive either. The list copy is
 * WebP, which every current browser shows.
 */
export async function reencodePhoto(input: Buffer, format: PhotoFormat): Promise<ProcessedPhoto> {
  try {
    // failOn 'warning' (sharp's default, the level its authors advise for untrusted input) refuses
    // truncated or damaged files instead of guessing at their missing pixels.
    const upright = sharp(input, { limitInputPixels: MAX_PHOTO_PIXELS, failOn: 'warning', autoOrient: true });
    const full = upright.clone().resize(PHOTO_LONG_EDGE, PHOTO_LONG_EDGE, { fit: 'inside', withoutEnlargement: true });
    const thumbnail = upright
      .clone()
      .resize(THUMBNAIL_LONG_EDGE, THUMBNAIL_LONG_EDGE, { fit: 'inside', withoutEnlargement: true })
      .webp({ quality: 72 });
    const [fullOut, thumbOut] = await Promise.all([encodeAs(full, format).toBuffer({ resolveWithObject: true }), thumbnail.toBuffer()]);
    return {
      full: { bytes: fullOut.data, contentType: format, ext: extensionOf[format] },
      thumbnail: { bytes: thumbOut, contentType: 'image/webp', ext: 'webp' },
      width: fullOut.info.width,
      height: fullOut.info.height,
    };
  } catch (error) {
    throw new UnreadablePhotoError(wordsFor(error));
  }
}

const extensionOf: Record<PhotoFormat, string> = { 'image/jpeg': 'jpg', 'image/png': 'png', 'image/webp': 'webp' };

function encodeAs(image: Sharp, format: PhotoFormat): Sharp {
  if (format === 'image/png') return image.png({ compressionLevel: 9 });
  if (format === 'image/webp') return image.webp({ quality: 85 });
  return image.jpeg({ quality: 85 });
}

function wordsFor(error: unknown): string {
  const message = error instanceof Error ? error.message : String(error);
  if (/pixel limit/i.test(message)) {
    return `file: the photo has more than ${MAX_PHOTO_PIXELS / 1_000_000} megapixels; send a smaller copy (a phone's "medium" size is plenty).`;
  }
  return 'file: the photo could not be read — it may be damaged or cut short; take or export it again and send the new copy.';
}
