import { useId, useState } from 'react';
import { cn } from './ui/cn';

/** The cautions of SPEC §7, shown where people act on the data. */
export type CautionTopic = 'one-call' | 'tolerance-zone' | 'excavation-entry' | 'casing-entry' | 'design-aid';

const CAUTIONS: Record<CautionTopic, { lead: string; text: string }> = {
  'one-call': {
    lead: 'Call before you dig.',
    text: 'Notify the one-call centre and wait for the marks before any digging, test holes included. Record the ticket number on the hole.',
  },
  'tolerance-zone': {
    lead: 'Inside the tolerance zone, dig by vacuum or hand only.',
    text: 'Within the locate tolerance zone that your state\u2019s one-call law sets around each mark, expose lines by vacuum excavation or careful hand digging, never with powered digging teeth.',
  },
  'excavation-entry': {
    lead: 'Enter trenches and pits only as the excavation safety rules allow.',
    text: 'A protective system where the rules require one, and inspection by a competent person, before anyone goes in.',
  },
  'casing-entry': {
    lead: 'Entering a casing is confined-space work.',
    text: 'Permit, atmosphere testing, an attendant and a rescue plan, as the confined-space rules in force require.',
  },
  'design-aid': {
    lead: 'Clearances here are a design aid.',
    text: 'A licensed engineer checks every figure against the line owner\u2019s and the local authority\u2019s requirements. Local codes and licensed practice govern.',
  },
};

const ALL: CautionTopic[] = ['one-call', 'tolerance-zone', 'excavation-entry', 'casing-entry', 'design-aid'];

/** Wide screens open the explanations at once; phones show the leads and a toggle. */
function startsOpen(): boolean {
  return typeof window !== 'undefined' && typeof window.matchMedia === 'function' && window.matchMedia('(min-width: 640px)').matches;
}

/** A caution banner listing the chosen topics (all of them by default). */
export function SafetyCautions({ topics = ALL, title = 'Digging near live lines can kill', className }: { topics?: CautionTopic[]; title?: string; className?: string }) {
  const [open, setOpen] = useState(startsOpen);
  const listId = useId();
  return (
    <aside aria-label="Safety cautions" className={cn('rounded-lg border border-caution-300 bg-caution-50 px-4 py-3 text-sm text-caution-900', className)}>
      <div className="flex items-start justify-between gap-3">
        <p className="flex items-center gap-2 font-semibold">
          <svg aria-hidden viewBox="0 0 20 20" className="size-5 shrink-0 fill-caution-600">
            <path d="M10 1.5 19 18H1L10 1.5Zm0 5.2a1 1 0 0 0-1 1V12a1 1 0 1 0 2 0V7.7a1 1 0 0 0-1-1Zm0 8.1a1.1 1.1 0 1 0 0 2.2 1.1 1.1 0 0 0 0-2.2Z" />
          </svg>
          {title}
        </p>
        <button
          type="button"
          className="-my-2 min-h-10 shrink-0 rounded px-2 text-xs font-medium text-caution-800 underline underline-offset-2 hover:bg-caution-100"
          aria-expanded={open}
          aria-controls={listId}
          onClick={() => setOpen(!open)}
        >
          {open ? 'Shorter' : 'Details'}
        </button>
      </div>
      <ul id={listId} className="mt-2 space-y-1.5">
        {topics.map((topic) => (
          <li key={topic} className="flex gap-2">
            <span aria-hidden className="mt-2 size-1.5 shrink-0 rounded-full bg-caution-600" />
            <span>
              <strong className="font-semibold">{CAUTIONS[topic].lead}</strong>
              {open && <> {CAUTIONS[topic].text}</>}
            </span>
          </li>
        ))}
      </ul>
    </aside>
  );
}
