import { useEffect, useState, type ReactNode } from 'react';

/**
 * Whether a box is wider inside than out, so that it scrolls sideways (a chart on a phone). Such a
 * box must take focus so the keyboard can scroll it with the arrow keys (WCAG 2.1 SC 2.1.1; axe's
 * `scrollable-region-focusable`); a box whose content fits stays out of the Tab order.
 * Measured again whenever the box or one of its children changes size.
 */
export function useScrollsSideways<E extends HTMLElement>(): [(el: E | null) => void, boolean] {
  const [box, setBox] = useState<E | null>(null);
  const [scrolls, setScrolls] = useState(false);
  useEffect(() => {
    if (!box) return;
    const measure = () => setScrolls(box.scrollWidth > box.clientWidth + 1);
    measure();
    if (typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver(measure);
    observer.observe(box);
    for (const child of box.children) observer.observe(child);
    return () => observer.disconnect();
  }, [box]);
  return [setBox, scrolls];
}

/**
 * The frame of a playground chart or diagram: it scrolls sideways rather than shrink the drawing
 * below legibility, and is a Tab stop only while it does.
 */
export function ChartFigure({
  children,
  className = 'p-3',
}: {
  children: ReactNode;
  className?: string;
}) {
  const [ref, scrolls] = useScrollsSideways<HTMLElement>();
  return (
    <figure
      ref={ref}
      tabIndex={scrolls ? 0 : undefined}
      className={`overflow-x-auto rounded-card border border-edge bg-panel ${className}`}
    >
      {children}
    </figure>
  );
}
