/** An outlined line of a hand-drawn glyph: no fill and rounded joins; `roundEnds` rounds its ends too. */
export function Stroke({
  d,
  width,
  color = 'currentColor',
  roundEnds = false,
}: {
  d: string;
  width: number;
  color?: string;
  roundEnds?: boolean;
}) {
  return (
    <path
      d={d}
      fill="none"
      stroke={color}
      strokeWidth={width}
      strokeLinecap={roundEnds ? 'round' : undefined}
      strokeLinejoin="round"
    />
  );
}
