import { useEffect, useRef, useState } from 'react';
import { toolKindLabels, toolNumberFromTag, type Tool } from '@shared/schemas/tools';
import { toolRefusal, type ToolRule } from '@shared/domain/tools';
import { formatDay } from '@shared/domain/when';
import { localDay } from '@shared/domain/local-time';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { QrGlyph } from '@/components/ui/qr-glyph';
import { QrScanner } from '@/components/ui/qr-scanner';
import { useTools } from '@/lib/shared-queries';

interface ToolPickerProps {
  /** What the tool is used for, in the refusal's words: "Brake accumulator pre-charge", "A top-up". */
  what: string;
  rule: ToolRule;
  /** The chosen tool's number, or undefined for none. */
  value: string | undefined;
  onChange: (number: string | undefined) => void;
}

const registerEntry = (tool: Tool) => ({ ...tool, retired: tool.retiredAt !== null });

/**
 * The tool a reading is taken with: scan its QR tag or pick it from large buttons. Tools whose calibration ran out
 * are shown but cannot be picked, with the reason; the server refuses them again at signing.
 */
export function ToolPicker({ what, rule, value, onChange }: ToolPickerProps) {
  const tools = useTools();
  const [open, setOpen] = useState(false);
  const [scanning, setScanning] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const list = useRef<HTMLDivElement>(null);
  // The list opens low on the screen: bring it above the bottom bar so every tool can be reached.
  useEffect(() => {
    if (open) list.current?.scrollIntoView({ block: 'center' });
  }, [open]);
  // The tablet's day: it stands in the hangar. Signing judges again on the type's local day.
  const day = localDay(new Date(), Intl.DateTimeFormat().resolvedOptions().timeZone);
  const fitting = (tools.data ?? []).filter((t) => rule.kinds.includes(t.kind) && t.retiredAt === null);
  const chosen = tools.data?.find((t) => t.number === value);
  const kinds = rule.kinds.map((k) => toolKindLabels[k].toLowerCase()).join(' or ');
  const choose = (number: string) => {
    const tool = tools.data?.find((t) => t.number === number);
    // With no register on the tablet (no network), a scanned tag is kept and signing judges it.
    if (!tool && tools.data)
      return setProblem(`Tool ${number} is not in the tools register. Pick another below.`);
    const refusal = tool ? toolRefusal(what, rule, registerEntry(tool), day) : null;
    if (refusal) return setProblem(refusal.message);
    setProblem(null);
    setOpen(false);
    onChange(number);
  };

  return (
    <section
      aria-label="Tool used"
      data-testid="tool-picker"
      className="flex flex-col gap-3 rounded-xl border-2 border-ink-line bg-ink-soft p-4"
    >
      <div className="flex flex-wrap items-center gap-4">
        <div className="min-w-[260px] flex-1 text-[24px]">
          {chosen ? (
            <>
              <div className="font-bold" data-testid="tool-chosen">
                {toolKindLabels[chosen.kind]} {chosen.number}
              </div>
              <div className="text-ink-muted">
                {chosen.description} · calibration due {formatDay(chosen.calibrationDue)}
              </div>
            </>
          ) : value ? (
            <div className="font-bold" data-testid="tool-chosen">
              Tool {value} (checked against the register when the check is signed)
            </div>
          ) : (
            <div className={rule.required ? 'font-semibold text-caution-text' : 'text-ink-muted'}>
              {rule.required
                ? `Name the ${kinds} you read this with.`
                : `${capital(kinds)} used: none named.`}
            </div>
          )}
        </div>
        <Button tone="neutral" size="large" onClick={() => setScanning(true)}>
          <QrGlyph /> Scan tool
        </Button>
        <Button tone="neutral" size="large" aria-expanded={open} onClick={() => setOpen(!open)}>
          Pick tool
        </Button>
        {value && !rule.required && (
          <Button tone="quiet" size="large" onClick={() => onChange(undefined)}>
            No tool
          </Button>
        )}
      </div>
      {problem && (
        <Notice tone="caution" title="Use another tool">
          {problem}
        </Notice>
      )}
      {open && (
        <div
          ref={list}
          className="grid grid-cols-2 gap-3 portrait:grid-cols-1"
          role="group"
          aria-label="Tools"
        >
          {tools.isPending && <p className="text-ink-muted">Loading the tools register…</p>}
          {tools.isError && (
            <p className="text-caution-text">The tools register did not load; scan the tag.</p>
          )}
          {fitting.map((tool) => {
            const refusal = toolRefusal(what, rule, registerEntry(tool), day);
            return (
              <Button
                key={tool.id}
                size="large"
                tone={tool.number === value ? 'primary' : 'neutral'}
                aria-pressed={tool.number === value}
                disabled={refusal !== null}
                onClick={() => choose(tool.number)}
                className="flex-col !items-start text-left"
              >
                <span>
                  {tool.number} · {toolKindLabels[tool.kind]}
                </span>
                <span className="text-[20px] font-normal">
                  {refusal ? `Calibration overdue since ${formatDay(tool.calibrationDue)}` : tool.description}
                </span>
              </Button>
            );
          })}
          {tools.isSuccess && fitting.length === 0 && (
            <p className="text-ink-muted">No {kinds} is in the tools register.</p>
          )}
        </div>
      )}
      {scanning && (
        <QrScanner
          what="tool tag"
          onClose={() => setScanning(false)}
          onResult={(text) => {
            setScanning(false);
            const number = toolNumberFromTag(text);
            if (number) choose(number);
            else
              setProblem('That QR code is not a Gaugewalk tool tag. Scan the tag on the tool, or pick it.');
          }}
        />
      )}
    </section>
  );
}

const capital = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);
