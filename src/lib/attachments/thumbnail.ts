import sharp from 'sharp';
import { THUMBNAIL_WIDTH } from './limits';

/**
 * A thumbnail of an image: {@link THUMBNAIL_WIDTH} px wide at most (never enlarged), turned
 * upright from its EXIF orientation, as WebP; null when the image cannot be decoded.
 */
export async function makeThumbnail(bytes: Uint8Array): Promise<Buffer | null> {
  try {
    return await sharp(bytes, { failOn: 'error', limitInputPixels: 100_000_000 })
      .rotate()
      .resize({ width: THUMBNAIL_WIDTH, withoutEnlargement: true })
      .webp({ quality: 80 })
      .toBuffer();
  } catch {
    return null;
  }
}
