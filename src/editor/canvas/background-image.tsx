import { useEffect, useState } from 'react';
import { Image as KonvaImage } from 'react-konva';
import type { Plan } from '../../../shared/plan/plan-schema';
import type { Camera } from '../geometry/coords';

/** The uploaded underlay, placed by its calibration (mm per image pixel) and origin. */
export function BackgroundImage({ background, camera }: { background: NonNullable<Plan['background']>; camera: Camera }) {
  const [img, setImg] = useState<HTMLImageElement | null>(null);
  useEffect(() => {
    const el = new window.Image();
    el.onload = () => setImg(el);
    el.src = background.url;
    return () => {
      el.onload = null;
    };
  }, [background.url]);
  if (!img) return null;
  const k = background.mmPerPx * camera.zoom;
  return (
    <KonvaImage
      image={img}
      x={background.originMm[0] * camera.zoom + camera.panX}
      y={background.originMm[1] * camera.zoom + camera.panY}
      width={img.naturalWidth * k}
      height={img.naturalHeight * k}
      opacity={background.opacity}
      listening={false}
    />
  );
}
