import { useCallback, useEffect, useLayoutEffect, useMemo, useRef, useState, type KeyboardEvent, type PointerEvent as ReactPointerEvent } from 'react';
import type { PlanePoint } from '#shared/tracer/affine';
import { Button } from '#src/components/Button';
import { drawScene, type Overlay } from '../lib/draw';
import { actualSizeView, fitView, toImage, toScreen, zoomAt, type CanvasView } from '../lib/view';

export type CanvasTool = 'calibrate' | 'trace' | 'look';

/** What the pointer can take hold of: the active line's points, and the reference clicks while calibrating. */
export interface CanvasTargets {
  points: { curveId: string; index: number; pixel: PlanePoint }[];
  clicks: { id: string; pixel: PlanePoint }[];
}

/** How close (screen pixels) a press must be to a point to take hold of it rather than add one. */
const GRAB_RADIUS = 8;
const WHEEL_STEP = 1.15;

type Gesture =
  | { kind: 'pan'; start: PlanePoint; view: CanvasView }
  | { kind: 'point'; curveId: string; index: number; dragId: string; moved: boolean; start: PlanePoint }
  | { kind: 'click'; id: string; dragId: string; moved: boolean; start: PlanePoint };

/**
 * The picture with the trace drawn over it. Scroll to zoom about the cursor, drag with the right
 * or middle button (or with Space held, or in the look tool) to pan; a magnifier beside the cursor
 * shows the picture four times larger for exact clicks. The canvas reports clicks and drags in
 * image pixels; what they mean is the editor's business.
 */
export function TraceCanvas({
  imageUrl,
  imageSize,
  overlay,
  tool,
  readOnly,
  targets,
  readout,
  hint,
  onPlace,
  onGrabPoint,
  onDragPoint,
  onGrabClick,
  onDragClick,
  onDeleteSelection,
  onNudge,
  onEscape,
}: {
  imageUrl: string;
  imageSize: { width: number; height: number };
  overlay: Overlay;
  tool: CanvasTool;
  readOnly: boolean;
  targets: CanvasTargets;
  /** Words for the values under the cursor (null before calibration). */
  readout: (pixel: PlanePoint) => string | null;
  hint: string;
  onPlace: (pixel: PlanePoint) => void;
  onGrabPoint: (curveId: string, index: number) => void;
  onDragPoint: (curveId: string, index: number, pixel: PlanePoint, dragId: string) => void;
  onGrabClick: (id: string) => void;
  onDragClick: (id: string, pixel: PlanePoint, dragId: string) => void;
  onDeleteSelection: () => void;
  onNudge: (dx: number, dy: number) => void;
  onEscape: () => void;
}) {
  const boxRef = useRef<HTMLDivElement>(null);
  const canvasRef = useRef<HTMLCanvasElement>(null);
  const [size, setSize] = useState({ width: 0, height: 0 });
  // The view the user zoomed or panned to; null while the picture is fitted to the canvas, so the
  // fitted view follows the canvas size and the picture.
  const [userView, setUserView] = useState<CanvasView | null>(null);
  const fitted = useMemo(() => (size.width > 0 ? fitView(imageSize, size) : null), [imageSize, size]);
  const view = userView ?? fitted;
  const [image, setImage] = useState<HTMLImageElement | null>(null);
  // The picture address that failed to load: the error shows while that address is the one asked for.
  const [failedUrl, setFailedUrl] = useState<string | null>(null);
  const imageError = failedUrl === imageUrl;
  const [cursorText, setCursorText] = useState<string | null>(null);
  const [spaceHeld, setSpaceHeld] = useState(false);
  const cursor = useRef<PlanePoint | null>(null);
  const gesture = useRef<Gesture | null>(null);
  const frame = useRef(0);

  // Everything the drawing needs, read when the frame is drawn.
  const scene = useRef({ overlay, view, image, size, tool });

  const draw = useCallback(() => {
    cancelAnimationFrame(frame.current);
    frame.current = requestAnimationFrame(() => {
      const canvas = canvasRef.current;
      const { overlay: o, view: v, image: img, size: s, tool: t } = scene.current;
      if (!canvas || !v || s.width === 0) return;
      const dpr = window.devicePixelRatio || 1;
      const ctx = canvas.getContext('2d');
      if (!ctx) return;
      ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
      drawScene(ctx, {
        width: s.width,
        height: s.height,
        view: v,
        image: img,
        imageSize,
        overlay: o,
        cursor: cursor.current,
        crosshair: t === 'calibrate' && !readOnly,
      });
    });
  }, [imageSize, readOnly]);

  // The canvas's backing store follows its box (a new size clears it; the drawing below repaints).
  useEffect(() => {
    const canvas = canvasRef.current;
    if (!canvas || size.width === 0) return;
    const dpr = window.devicePixelRatio || 1;
    canvas.width = Math.round(size.width * dpr);
    canvas.height = Math.round(size.height * dpr);
  }, [size]);

  useEffect(() => {
    scene.current = { overlay, view, image, size, tool };
    draw();
  }, [draw, overlay, view, image, size, tool]);
  useEffect(() => () => cancelAnimationFrame(frame.current), []);

  useEffect(() => {
    const img = new Image();
    img.decoding = 'async';
    img.onload = () => {
      setImage(img);
      setFailedUrl(null);
    };
    img.onerror = () => setFailedUrl(imageUrl);
    img.src = imageUrl;
    return () => {
      img.onload = null;
      img.onerror = null;
    };
  }, [imageUrl]);

  // The canvas follows its box; the picture stays fitted until the user zooms.
  useLayoutEffect(() => {
    const box = boxRef.current;
    if (!box) return;
    const observer = new ResizeObserver(([entry]) => {
      const width = Math.floor(entry.contentRect.width);
      const height = Math.floor(entry.contentRect.height);
      setSize((s) => (s.width === width && s.height === height ? s : { width, height }));
    });
    observer.observe(box);
    return () => observer.disconnect();
  }, []);

  const zoomBy = useCallback(
    (factor: number, anchor?: PlanePoint) => {
      setUserView((v) => {
        const from = v ?? fitted;
        return from ? zoomAt(from, factor, anchor ?? { x: size.width / 2, y: size.height / 2 }) : v;
      });
    },
    [size, fitted],
  );

  // Wheel zoom needs a non-passive listener to keep the page from scrolling.
  useEffect(() => {
    const canvas = canvasRef.current;
    if (!canvas) return;
    const onWheel = (event: WheelEvent) => {
      event.preventDefault();
      const rect = canvas.getBoundingClientRect();
      const steps = Math.max(-5, Math.min(5, -event.deltaY / (event.deltaMode === 1 ? 3 : 100)));
      zoomBy(WHEEL_STEP ** steps, { x: event.clientX - rect.left, y: event.clientY - rect.top });
    };
    canvas.addEventListener('wheel', onWheel, { passive: false });
    return () => canvas.removeEventListener('wheel', onWheel);
  }, [zoomBy]);

  function local(event: { clientX: number; clientY: number }): PlanePoint {
    const rect = canvasRef.current!.getBoundingClientRect();
    return { x: event.clientX - rect.left, y: event.clientY - rect.top };
  }

  function nearest<T extends { pixel: PlanePoint }>(items: T[], screen: PlanePoint): T | null {
    if (!view) return null;
    let best: T | null = null;
    let bestDistance = GRAB_RADIUS;
    for (const item of items) {
      const s = toScreen(view, item.pixel);
      const d = Math.hypot(s.x - screen.x, s.y - screen.y);
      if (d <= bestDistance) [best, bestDistance] = [item, d];
    }
    return best;
  }

  function onPointerDown(event: ReactPointerEvent<HTMLCanvasElement>) {
    if (!view) return;
    canvasRef.current?.focus({ preventScroll: true });
    const screen = local(event);
    event.currentTarget.setPointerCapture(event.pointerId);
    if (event.button === 1 || event.button === 2 || spaceHeld || tool === 'look' || readOnly) {
      gesture.current = { kind: 'pan', start: screen, view };
      return;
    }
    if (event.button !== 0) return;
    const dragId = `${Date.now()}-${Math.random()}`;
    if (tool === 'trace') {
      const hit = nearest(targets.points, screen);
      if (hit) {
        onGrabPoint(hit.curveId, hit.index);
        gesture.current = { kind: 'point', curveId: hit.curveId, index: hit.index, dragId, moved: false, start: screen };
        return;
      }
    }
    if (tool === 'calibrate') {
      const hit = nearest(targets.clicks, screen);
      if (hit) {
        onGrabClick(hit.id);
        gesture.current = { kind: 'click', id: hit.id, dragId, moved: false, start: screen };
        return;
      }
    }
    gesture.current = null;
    onPlace(toImage(view, screen));
  }

  function onPointerMove(event: ReactPointerEvent<HTMLCanvasElement>) {
    const screen = local(event);
    cursor.current = screen;
    const g = gesture.current;
    if (view) setCursorText(readout(toImage(view, screen)));
    if (g?.kind === 'pan') {
      setUserView({ ...g.view, x: g.view.x + screen.x - g.start.x, y: g.view.y + screen.y - g.start.y });
      return;
    }
    if (g && view) {
      // A press that wanders less than 3 px is a click, not a drag.
      if (!g.moved && Math.hypot(screen.x - g.start.x, screen.y - g.start.y) < 3) return draw();
      g.moved = true;
      const pixel = toImage(view, screen);
      if (g.kind === 'point') onDragPoint(g.curveId, g.index, pixel, g.dragId);
      else onDragClick(g.id, pixel, g.dragId);
    }
    draw();
  }

  function onPointerUp(event: ReactPointerEvent<HTMLCanvasElement>) {
    gesture.current = null;
    if (event.currentTarget.hasPointerCapture(event.pointerId)) event.currentTarget.releasePointerCapture(event.pointerId);
  }

  function onPointerLeave() {
    cursor.current = null;
    setCursorText(null);
    draw();
  }

  function onKeyDown(event: KeyboardEvent<HTMLCanvasElement>) {
    const step = event.shiftKey ? 10 : 1;
    const moves: Record<string, [number, number]> = { ArrowLeft: [-step, 0], ArrowRight: [step, 0], ArrowUp: [0, -step], ArrowDown: [0, step] };
    if (event.key === ' ') {
      setSpaceHeld(true);
      event.preventDefault();
    } else if (event.key === 'Delete' || event.key === 'Backspace') {
      if (!readOnly) onDeleteSelection();
      event.preventDefault();
    } else if (event.key === 'Escape') {
      onEscape();
    } else if (event.key === '+' || event.key === '=') {
      zoomBy(1.25);
    } else if (event.key === '-') {
      zoomBy(0.8);
    } else if (event.key === '0') {
      setUserView(null);
    } else if (moves[event.key]) {
      event.preventDefault();
      if (!readOnly) onNudge(...moves[event.key]);
    }
  }

  const percent = view ? Math.round(view.scale * 100) : null;
  return (
    <div className="flex h-full flex-col">
      <div className="flex flex-wrap items-center gap-2 border-b border-paper-line bg-white/70 px-3 py-2" role="toolbar" aria-label="Picture view">
        <Button onClick={() => zoomBy(0.8)} aria-label="Zoom out" className="px-2.5">
          −
        </Button>
        <span className="numeric w-14 text-center text-sm text-ink-soft" aria-live="polite" aria-label="Zoom">
          {percent === null ? '—' : `${percent} %`}
        </span>
        <Button onClick={() => zoomBy(1.25)} aria-label="Zoom in" className="px-2.5">
          +
        </Button>
        <Button
          onClick={() => {
            setUserView(null);
          }}
        >
          Fit
        </Button>
        <Button
          onClick={() => {
            setUserView((v) => {
              const from = v ?? fitted;
              return from ? actualSizeView(from, { x: size.width / 2, y: size.height / 2 }) : v;
            });
          }}
          aria-label="Actual size"
        >
          1:1
        </Button>
        <p className="ml-auto text-sm text-ink-soft">{hint}</p>
      </div>
      <div ref={boxRef} className="relative min-h-0 flex-1 overflow-hidden">
        <canvas
          ref={canvasRef}
          tabIndex={0}
          role="img"
          aria-label={`The picture being traced, ${imageSize.width} × ${imageSize.height} pixels, with the trace drawn over it. ${hint}`}
          data-view-scale={view?.scale}
          data-view-x={view?.x}
          data-view-y={view?.y}
          className={`absolute inset-0 h-full w-full touch-none focus:outline-none focus-visible:ring-2 focus-visible:ring-teal ${
            spaceHeld || tool === 'look' || readOnly ? 'cursor-grab' : 'cursor-crosshair'
          }`}
          onPointerDown={onPointerDown}
          onPointerMove={onPointerMove}
          onPointerUp={onPointerUp}
          onPointerCancel={onPointerUp}
          onPointerLeave={onPointerLeave}
          onContextMenu={(event) => event.preventDefault()}
          onKeyDown={onKeyDown}
          onKeyUp={(event) => {
            if (event.key === ' ') setSpaceHeld(false);
          }}
          onBlur={() => setSpaceHeld(false)}
        />
        {!image && (
          <p role={imageError ? 'alert' : 'status'} className="absolute inset-0 flex items-center justify-center p-6 text-center text-sm text-ink-soft">
            {imageError
              ? 'The picture could not be shown. It may be damaged; reload the page, or start again from another copy of it.'
              : 'Loading the picture…'}
          </p>
        )}
      </div>
      <p className="numeric min-h-9 border-t border-paper-line bg-white/70 px-3 py-2 text-sm text-ink-soft" aria-live="off">
        {cursorText ?? 'Move over the picture to read its values here.'}
      </p>
    </div>
  );
}
