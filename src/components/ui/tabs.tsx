import * as RadixTabs from '@radix-ui/react-tabs';
import type { ReactNode } from 'react';
import { cn } from '../../lib/cn';

type Look = 'folder' | 'pill';

const lists: Record<Look, string> = {
  folder: 'flex flex-wrap gap-1 border-b border-paper-line',
  pill: 'flex flex-wrap gap-1',
};
const triggers: Record<Look, string> = {
  folder:
    'rounded-t-md px-3 py-2 text-sm text-graphite-light hover:text-graphite data-[state=active]:border data-[state=active]:border-b-0 data-[state=active]:border-paper-line data-[state=active]:bg-white data-[state=active]:font-semibold data-[state=active]:text-graphite',
  pill: 'rounded-md px-3 py-1.5 text-sm text-graphite hover:bg-paper-dark data-[state=active]:bg-graphite data-[state=active]:text-white',
};
const focus = 'focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-teal';

type Props<T extends string> = {
  /** What the tabs choose between, read out before them ("Settings sections", "Show"). */
  label: string;
  value: T;
  onValueChange: (value: T) => void;
  tabs: ReadonlyArray<{ value: T; label: string }>;
  look?: Look;
  className?: string;
  panelClassName?: string;
  /** The panel of the chosen tab. */
  children: ReactNode;
};

/**
 * Tabs with the WAI-ARIA tabs pattern (Radix): one tab in the Tab order, arrow keys, Home and End
 * move between them, and the panel is labelled by its tab. Only the chosen panel is rendered.
 */
export function Tabs<T extends string>({ label, value, onValueChange, tabs, look = 'folder', className, panelClassName, children }: Props<T>) {
  return (
    <RadixTabs.Root value={value} onValueChange={(v) => onValueChange(v as T)} className={className} activationMode="manual">
      <RadixTabs.List aria-label={label} className={lists[look]}>
        {tabs.map((t) => (
          <RadixTabs.Trigger key={t.value} value={t.value} className={cn(triggers[look], focus)}>
            {t.label}
          </RadixTabs.Trigger>
        ))}
      </RadixTabs.List>
      <RadixTabs.Content value={value} className={cn('rounded-sm', focus, panelClassName)}>
        {children}
      </RadixTabs.Content>
    </RadixTabs.Root>
  );
}
