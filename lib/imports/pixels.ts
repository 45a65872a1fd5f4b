import sharp from "sharp";
import { limits } from "./limits";

/** Side of the colour thumbnail behind the default image vector: 8 × 8 pixels × RGB = 192 numbers in [0, 1]. */
export const pixelGrid = 8;
export const pixelVectorWidth = pixelGrid * pixelGrid * 3;
export const pixelVectorName = "pixels_8x8_rgb";
export const imageFormats = new Set(["png", "jpeg", "webp"]);

export type DecodedImage = { format: string; width: number; height: number; vector: Float32Array; thumb: Buffer };

/**
 * The default feature vector: the image flattened onto white, converted to sRGB and resized (ignoring aspect)
 * to 8 × 8 with sharp's default Lanczos-3 kernel; the 192 channel values in row-major RGB order, divided by 255.
 */
export async function pixelVector(bytes: Uint8Array): Promise<Float32Array> {
  const { data, info } = await sharp(bytes, { limitInputPixels: limits.imageMaxPixels })
    .flatten({ background: "#ffffff" })
    .toColourspace("srgb")
    .resize(pixelGrid, pixelGrid, { fit: "fill" })
    .removeAlpha()
    .raw()
    .toBuffer({ resolveWithObject: true });
  if (info.channels !== 3) throw new Error(`expected 3 channels, got ${info.channels}`);
  const out = new Float32Array(pixelVectorWidth);
  for (let i = 0; i < pixelVectorWidth; i += 1) out[i] = data[i] / 255;
  return out;
}

/** Checks the bytes are a PNG, JPEG or WebP image, and makes its vector and a 256-pixel WebP thumbnail. */
export async function decodeImage(bytes: Uint8Array, withVector = true): Promise<DecodedImage> {
  const meta = await sharp(bytes, { limitInputPixels: limits.imageMaxPixels }).metadata();
  if (!meta.format || !imageFormats.has(meta.format)) throw new Error(`it is ${meta.format ?? "an unknown format"}, not PNG, JPEG or WebP`);
  const thumb = await sharp(bytes, { limitInputPixels: limits.imageMaxPixels }).rotate().resize(256, 256, { fit: "inside", withoutEnlargement: true }).webp({ quality: 80 }).toBuffer();
  const vector = withVector ? await pixelVector(bytes) : new Float32Array(0);
  return { format: meta.format, width: meta.width ?? 0, height: meta.height ?? 0, vector, thumb };
}
