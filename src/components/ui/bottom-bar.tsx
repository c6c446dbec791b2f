import { useLayoutEffect, useRef, type ReactNode, type RefObject } from 'react';

const scrollVar = '--gw-bottom-bar';
const fixedVar = '--gw-fixed-bar';

/**
 * Tells the page how tall a bar pinned to the bottom edge is, for as long as it is on screen: the page keeps that
 * much room at its foot (scroll-padding-bottom in index.css), so scrolling a key into view, by a finger or by the
 * browser's focus, never leaves it under the bar. A fixed bar also pads the page, so the last control can scroll
 * clear of it.
 */
export function useReservedBottom(ref: RefObject<HTMLElement | null>, fixed = false) {
  useLayoutEffect(() => {
    const bar = ref.current;
    if (!bar) return;
    const root = document.documentElement.style;
    const reserve = () => {
      const height = `${Math.ceil(bar.getBoundingClientRect().height)}px`;
      root.setProperty(scrollVar, height);
      if (fixed) root.setProperty(fixedVar, height);
    };
    reserve();
    const observer = new ResizeObserver(reserve);
    observer.observe(bar);
    return () => {
      observer.disconnect();
      root.removeProperty(scrollVar);
      if (fixed) root.removeProperty(fixedVar);
    };
  }, [ref, fixed]);
}

/**
 * Scrolls a step so that its entry (a keypad, a glass, the answers) is clear of the bottom bar, without pushing its
 * heading off the top: a gloved tap meant for "0" must land on "0", not on Next.
 */
export function useStepInView(
  heading: RefObject<HTMLElement | null>,
  entry: RefObject<HTMLElement | null>,
  bar: RefObject<HTMLElement | null>,
  key: unknown,
) {
  useLayoutEffect(() => {
    const top = heading.current?.getBoundingClientRect().top;
    const bottom = entry.current?.getBoundingClientRect().bottom;
    if (top === undefined || bottom === undefined) return;
    const barTop = window.innerHeight - (bar.current?.getBoundingClientRect().height ?? 0);
    const margin = 12;
    // The smallest scroll that shows both the heading and the entry's foot; if they cannot both fit, the heading
    // goes to the top and the rest is one finger-scroll away.
    const least = bottom - (barTop - margin);
    const most = top - margin;
    const by = least > most ? most : Math.min(Math.max(0, least), most);
    if (by !== 0) window.scrollBy({ top: by, behavior: 'instant' });
  }, [heading, entry, bar, key]);
}

/** Back and Next (or the like) that stay under the thumb whatever the screen height, with room kept for them. */
export function BottomBar({
  children,
  barRef,
}: {
  children: ReactNode;
  barRef?: RefObject<HTMLDivElement | null>;
}) {
  const own = useRef<HTMLDivElement>(null);
  const ref = barRef ?? own;
  useReservedBottom(ref);
  return (
    <div
      ref={ref}
      data-testid="bottom-bar"
      className="sticky bottom-0 z-30 -mx-6 flex gap-4 border-t-2 border-ink-line bg-ink/95 px-6 py-3"
    >
      {children}
    </div>
  );
}
