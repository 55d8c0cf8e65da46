// A frame for a table wider than the screen: it scrolls sideways inside itself (touch, mouse or arrow keys), and while
// columns lie out of sight it says so in words and shades the edge they hide behind, so a phone user knows to swipe.
// Tables inside keep their first column sticky, so each row stays named while the rest slides under it.
import { useCallback, useEffect, useRef, useState, type ReactNode } from 'react';

interface HiddenSides {
  left: boolean;
  right: boolean;
}

/** Which sides of the frame hide content; a pixel of slack absorbs sub-pixel widths. */
function hiddenSides(el: HTMLElement): HiddenSides {
  const slack = 1;
  return { left: el.scrollLeft > slack, right: el.scrollLeft + el.clientWidth < el.scrollWidth - slack };
}

export function SidewaysScroll({ label, children, className = '' }: { label: string; children: ReactNode; className?: string }) {
  const frame = useRef<HTMLDivElement>(null);
  const [hidden, setHidden] = useState<HiddenSides>({ left: false, right: false });
  const measure = useCallback(() => {
    if (frame.current) setHidden(hiddenSides(frame.current));
  }, []);
  useEffect(() => {
    const el = frame.current;
    if (!el) return;
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(el);
    if (el.firstElementChild) observer.observe(el.firstElementChild);
    return () => observer.disconnect();
  }, [measure]);
  const overflowing = hidden.left || hidden.right;
  return (
    <div className="relative">
      <div
        ref={frame}
        onScroll={measure}
        className={`overflow-x-auto focus-visible:outline focus-visible:outline-2 focus-visible:outline-field-600 ${className}`}
        role="region"
        aria-label={overflowing ? `${label} (scrolls sideways)` : label}
        tabIndex={0}
        data-hidden-columns={hidden.right ? 'right' : hidden.left ? 'left' : 'none'}
      >
        {children}
      </div>
      <span
        aria-hidden="true"
        className={`pointer-events-none absolute inset-y-0 right-0 w-8 rounded-r-lg bg-gradient-to-l from-soil-900/15 to-transparent transition-opacity print:hidden ${hidden.right ? 'opacity-100' : 'opacity-0'}`}
      />
      {overflowing && (
        <p className="mt-1 text-right text-xs text-soil-700 print:hidden" data-scroll-cue>
          {hidden.right ? 'More columns to the right: swipe the table sideways →' : '← Swipe back for the first columns'}
        </p>
      )}
    </div>
  );
}
