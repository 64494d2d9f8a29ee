/**
 * Tabs as the WAI-ARIA Authoring Practices "Tabs" pattern describes them
 * (https://www.w3.org/WAI/ARIA/apg/patterns/tabs/): one tab in the Tab order (roving tabindex),
 * Left/Right move to the previous/next tab (wrapping), Home/End to the first/last; a tab is
 * selected as it gets focus (automatic activation). Each tab names its panel in aria-controls;
 * the caller renders every panel with `tabPanelProps`, so each reference resolves.
 */
import { useRef, type KeyboardEvent } from 'react';

export interface TabItem<T extends string> {
  id: T;
  label: string;
}

interface TabListProps<T extends string> {
  /** Accessible name of the tab list. */
  label: string;
  /** Keeps the ids of this tab set apart from another on the page. */
  idPrefix: string;
  tabs: readonly TabItem<T>[];
  selected: T;
  onSelect: (id: T) => void;
  className?: string;
}

export const tabElementId = (prefix: string, id: string) => `${prefix}-tab-${id}`;
export const tabPanelElementId = (prefix: string, id: string) => `${prefix}-panel-${id}`;

/** The attributes of the panel of tab `id`: hidden unless selected, focusable, named by its tab. */
export function tabPanelProps(prefix: string, id: string, selected: string) {
  return {
    role: 'tabpanel',
    id: tabPanelElementId(prefix, id),
    'aria-labelledby': tabElementId(prefix, id),
    hidden: id !== selected,
    tabIndex: 0,
  } as const;
}

export function TabList<T extends string>({ label, idPrefix, tabs, selected, onSelect, className = '' }: TabListProps<T>) {
  const refs = useRef(new Map<T, HTMLButtonElement>());

  const move = (event: KeyboardEvent<HTMLDivElement>) => {
    const index = tabs.findIndex((tab) => tab.id === selected);
    const last = tabs.length - 1;
    const next: Record<string, number> = {
      ArrowRight: index === last ? 0 : index + 1,
      ArrowLeft: index === 0 ? last : index - 1,
      Home: 0,
      End: last,
    };
    const target = tabs[next[event.key] ?? -1];
    if (!target) return;
    event.preventDefault();
    onSelect(target.id);
    refs.current.get(target.id)?.focus();
  };

  return (
    <div role="tablist" aria-label={label} className={`flex flex-wrap gap-1 border-b border-paper-line ${className}`} onKeyDown={move}>
      {tabs.map((tab) => {
        const isSelected = tab.id === selected;
        return (
          <button
            key={tab.id}
            ref={(element) => {
              if (element) refs.current.set(tab.id, element);
              else refs.current.delete(tab.id);
            }}
            type="button"
            role="tab"
            id={tabElementId(idPrefix, tab.id)}
            aria-selected={isSelected}
            aria-controls={tabPanelElementId(idPrefix, tab.id)}
            tabIndex={isSelected ? 0 : -1}
            onClick={() => onSelect(tab.id)}
            className={`-mb-px rounded-t border px-2 py-1 text-sm ${isSelected ? 'border-paper-line border-b-white bg-white font-semibold text-ink' : 'border-transparent text-ink-soft'}`}
          >
            {tab.label}
          </button>
        );
      })}
    </div>
  );
}
