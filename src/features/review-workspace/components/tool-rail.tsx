// The markup tools as a narrow vertical rail beside the page thumbnails: each tool with a
// drawn glyph, its name and its number key, then the four markup colours by name.
import { MARKUP_COLOURS, type MarkupColour } from '@shared/schemas/reviews';
import { COLOUR_NAMES, COLOURS, TOOLS, type Tool } from '../lib/tools';

function Glyph({ tool }: { tool: Tool }) {
  const common = {
    className: 'size-4',
    viewBox: '0 0 16 16',
    'aria-hidden': true,
    fill: 'none',
    stroke: 'currentColor',
    strokeWidth: 1.5,
  } as const;
  switch (tool) {
    case 'select':
      return (
        <svg {...common}>
          <path d="M3 2 L3 12.5 L6 9.8 L8.2 14 L10 13.1 L7.9 9 L12 9 Z" strokeLinejoin="round" />
        </svg>
      );
    case 'rectangle':
      return (
        <svg {...common}>
          <rect x="2" y="3.5" width="12" height="9" />
        </svg>
      );
    case 'ellipse':
      return (
        <svg {...common}>
          <ellipse cx="8" cy="8" rx="6" ry="4.5" />
        </svg>
      );
    case 'cloud':
      return (
        <svg {...common}>
          <path d="M2.5 5 A1.6 1.6 0 0 1 5.5 4 A1.6 1.6 0 0 1 8.5 4 A1.6 1.6 0 0 1 11.5 4 A1.6 1.6 0 0 1 13.5 6.5 A1.6 1.6 0 0 1 13.5 10 A1.6 1.6 0 0 1 10.5 12 A1.6 1.6 0 0 1 7.5 12 A1.6 1.6 0 0 1 4.5 12 A1.6 1.6 0 0 1 2.5 9.5 A1.6 1.6 0 0 1 2.5 5 Z" />
        </svg>
      );
    case 'arrow':
      return (
        <svg {...common}>
          <path d="M2.5 13.5 L12 4" />
          <path d="M7.5 3.5 H12.5 V8.5" />
        </svg>
      );
    case 'text':
      return (
        <svg {...common}>
          <path d="M3 3.5 H13 M8 3.5 V13 M6 13 H10" />
        </svg>
      );
    case 'pin':
      return (
        <svg {...common}>
          <circle cx="8" cy="7" r="4.5" fill="currentColor" />
          <path d="M8 11.5 V14.5" />
        </svg>
      );
  }
}

export function ToolRail({
  tool,
  onTool,
  colour,
  onColour,
  disabled,
}: {
  tool: Tool;
  onTool: (tool: Tool) => void;
  colour: MarkupColour;
  onColour: (colour: MarkupColour) => void;
  disabled: boolean;
}) {
  return (
    <div className="flex w-[68px] shrink-0 flex-col gap-3 border-r border-rule bg-sheet px-1.5 py-2">
      <div
        role="toolbar"
        aria-label="Markup tools"
        aria-orientation="vertical"
        className="flex flex-col gap-1"
      >
        {TOOLS.map((t) => (
          <button
            key={t.tool}
            type="button"
            title={`${t.hint} (key ${t.key})`}
            aria-pressed={tool === t.tool}
            disabled={disabled}
            onClick={() => onTool(t.tool)}
            className={`relative flex flex-col items-center rounded-[3px] border px-1 py-1 text-[11.5px] font-bold leading-tight disabled:cursor-not-allowed disabled:opacity-45 ${
              tool === t.tool
                ? 'border-graphite bg-graphite text-chalk'
                : 'border-transparent text-ink hover:border-rule-strong'
            }`}
          >
            <Glyph tool={t.tool} />
            {t.label}
            <span
              aria-hidden="true"
              className={`absolute right-0.5 top-0 text-[9.5px] font-normal ${tool === t.tool ? 'text-steel' : 'text-ink-soft'}`}
            >
              {t.key}
            </span>
          </button>
        ))}
      </div>
      <fieldset disabled={disabled} className="flex flex-col gap-1 disabled:opacity-45">
        <legend className="mb-1 text-center text-[10.5px] font-bold uppercase tracking-[0.06em] text-ink-soft">
          Ink
        </legend>
        {COLOURS.map((c) => (
          <label
            key={c}
            title={COLOUR_NAMES[c]}
            className={`flex cursor-pointer flex-col items-center rounded-[3px] border py-0.5 text-[10.5px] ${colour === c ? 'border-ink font-bold' : 'border-transparent'}`}
          >
            <input
              type="radio"
              name="markup-colour"
              className="sr-only"
              checked={colour === c}
              onChange={() => onColour(c)}
            />
            <span
              aria-hidden="true"
              className="block h-2.5 w-7 rounded-[2px]"
              style={{ background: MARKUP_COLOURS[c] }}
            />
            {COLOUR_NAMES[c]}
          </label>
        ))}
      </fieldset>
    </div>
  );
}
