import { useRef, useState } from 'react';
import { toDisplayRect, toImageRect, type PixelRect, type Point, type Size } from '../patch';

interface PatchPickerProps {
  src: string;
  natural: Size | null;
  onNaturalSize: (size: Size) => void;
  patch: PixelRect | null;
  onPatch: (patch: PixelRect | null) => void;
}

/** The preview: drag over it to mark the neutral patch (a grey card or white wall in the shot). */
export function PatchPicker({ src, natural, onNaturalSize, patch, onPatch }: PatchPickerProps) {
  const imageRef = useRef<HTMLImageElement>(null);
  const [start, setStart] = useState<Point | null>(null);
  const [displayed, setDisplayed] = useState<Size | null>(null);

  const local = (event: React.PointerEvent): Point => {
    const box = imageRef.current!.getBoundingClientRect();
    return { x: event.clientX - box.left, y: event.clientY - box.top };
  };
  const measure = (): Size | null => {
    const image = imageRef.current;
    if (!image) return null;
    const size = { width: image.clientWidth, height: image.clientHeight };
    setDisplayed(size);
    return size;
  };
  const update = (event: React.PointerEvent) => {
    const size = measure();
    if (!start || !size || !natural) return;
    onPatch(toImageRect(start, local(event), size, natural));
  };

  const overlay = patch && displayed && natural ? toDisplayRect(patch, displayed, natural) : null;

  return (
    <div className="relative inline-block max-w-full touch-none select-none">
      <img
        ref={imageRef}
        src={src}
        alt="Preview of the test frame; drag over it to mark the neutral patch"
        draggable={false}
        className="block max-h-[60vh] max-w-full cursor-crosshair"
        onLoad={(event) => {
          onNaturalSize({
            width: event.currentTarget.naturalWidth,
            height: event.currentTarget.naturalHeight,
          });
          measure();
        }}
        onPointerDown={(event) => {
          event.currentTarget.setPointerCapture(event.pointerId);
          setStart(local(event));
          measure();
        }}
        onPointerMove={(event) => {
          if (start) update(event);
        }}
        onPointerUp={(event) => {
          update(event);
          setStart(null);
        }}
      />
      {overlay ? (
        <div
          aria-hidden="true"
          className="pointer-events-none absolute border-2 border-accent shadow-[0_0_0_1px_var(--color-canvas)]"
          style={{ left: overlay.x, top: overlay.y, width: overlay.width, height: overlay.height }}
        />
      ) : null}
    </div>
  );
}
