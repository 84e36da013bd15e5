/** The island version of Icon.astro: the same shapes from icon-paths.ts, decorative unless labelled. */
import { ICONS, type IconName, type IconShape } from './icon-paths';

export function Icon({ name, size = 24, label, className }: { name: IconName; size?: number; label?: string; className?: string }) {
  const shape: IconShape = ICONS[name];
  return (
    <svg
      width={size}
      height={size}
      viewBox="0 0 24 24"
      fill="none"
      stroke="currentColor"
      strokeWidth={2}
      strokeLinecap="round"
      strokeLinejoin="round"
      className={className}
      role={label ? 'img' : undefined}
      aria-label={label}
      aria-hidden={label ? undefined : true}
    >
      {shape.strokes.map((d) => (
        <path key={d} d={d} />
      ))}
      {(shape.fills ?? []).map((d) => (
        <path key={d} d={d} fill="currentColor" stroke="none" />
      ))}
    </svg>
  );
}
