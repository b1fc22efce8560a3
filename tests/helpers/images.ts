import sharp from 'sharp';

/** A plain grey PNG of the given size, made with sharp, for upload tests. */
export function pngImage(width: number, height: number): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: { r: 120, g: 120, b: 120 } } })
    .png()
    .toBuffer();
}
