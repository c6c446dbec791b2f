import { useEffect, useRef, useState } from 'react';
import { toolNumberFromTag, type Tool } from '@shared/schemas/tools';
import { toolRefusal, type ToolRule } from '@shared/domain/tools';
import { calendarDay } from '@/lib/when';
import { localDay } from '@shared/domain/local-time';
import { phraseWords } from '@shared/i18n/phrase';
import { Button } from '@/components/ui/button';
import { Notice } from '@/components/ui/notice';
import { QrGlyph } from '@/components/ui/qr-glyph';
import { QrScanner } from '@/components/ui/qr-scanner';
import { useTools } from '@/lib/shared-queries';
import { useCheckWords } from '../model/check-words';

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
  const { t, words } = useCheckWords();
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
  const kinds = rule.kinds.map((k) => words.toolKindInSentence(k)).join(t('tools.or'));
  const choose = (number: string) => {
    const tool = tools.data?.find((t) => t.number === number);
    // With no register on the tablet (no network), a scanned tag is kept and signing judges it.
    if (!tool && tools.data) return setProblem(t('tools.notInRegister', { number }));
    const refusal = tool ? toolRefusal(what, rule, registerEntry(tool), day) : null;
    if (refusal) return setProblem(phraseWords(refusal.reason));
    setProblem(null);
    setOpen(false);
    onChange(number);
  };

  return (
    <section
      aria-label={t('tools.label')}
      data-testid="tool-picker"
      className="flex flex-col gap-3 rounded-xl border-2 border-ink-line bg-ink-soft p-4"
    >
      <div className="flex flex-wrap items-center gap-4">
        <div className="min-w-[260px] flex-1 text-[24px]">
          {chosen ? (
            <>
              <div className="font-bold" data-testid="tool-chosen">
                {words.toolKind(chosen.kind)} {chosen.number}
              </div>
              <div className="text-ink-muted">
                {t('tools.calibrationDue', {
                  description: chosen.description,
                  day: calendarDay(chosen.calibrationDue),
                })}
              </div>
            </>
          ) : value ? (
            <div className="font-bold" data-testid="tool-chosen">
              {t('tools.unchecked', { number: value })}
            </div>
          ) : (
            <div className={rule.required ? 'font-semibold text-caution-text' : 'text-ink-muted'}>
              {rule.required
                ? t('tools.nameOne', { kinds })
                : t('tools.noneNamed', { kinds: capital(kinds) })}
            </div>
          )}
        </div>
        <Button tone="neutral" size="large" onClick={() => setScanning(true)}>
          <QrGlyph /> {t('tools.scan')}
        </Button>
        <Button tone="neutral" size="large" aria-expanded={open} onClick={() => setOpen(!open)}>
          {t('tools.pick')}
        </Button>
        {value && !rule.required && (
          <Button tone="quiet" size="large" onClick={() => onChange(undefined)}>
            {t('tools.noTool')}
          </Button>
        )}
      </div>
      {problem && (
        <Notice tone="caution" title={t('tools.useAnother')}>
          {problem}
        </Notice>
      )}
      {open && (
        <div
          ref={list}
          className="grid grid-cols-2 gap-3 portrait:grid-cols-1"
          role="group"
          aria-label={t('tools.list')}
        >
          {tools.isPending && <p className="text-ink-muted">{t('tools.loading')}</p>}
          {tools.isError && <p className="text-caution-text">{t('tools.loadFailed')}</p>}
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
                  {tool.number} · {words.toolKind(tool.kind)}
                </span>
                <span className="text-[20px] font-normal">
                  {refusal ? t('tools.overdue', { day: calendarDay(tool.calibrationDue) }) : tool.description}
                </span>
              </Button>
            );
          })}
          {tools.isSuccess && fitting.length === 0 && (
            <p className="text-ink-muted">{t('tools.noneOfKind', { kinds })}</p>
          )}
        </div>
      )}
      {scanning && (
        <QrScanner
          what={t('tools.scanWhat')}
          onClose={() => setScanning(false)}
          onResult={(text) => {
            setScanning(false);
            const number = toolNumberFromTag(text);
            if (number) choose(number);
            else setProblem(t('tools.notATag'));
          }}
        />
      )}
    </section>
  );
}

const capital = (text: string) => text.charAt(0).toUpperCase() + text.slice(1);
