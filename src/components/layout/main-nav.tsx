import { NavLink } from 'react-router-dom';
import type { NavItem } from '../../app/nav-items';
import { cn } from '../../lib/cn';

/** The role's navigation links; laid out in a row (desktop) or a column (the phone menu). */
export function MainNav({ items, vertical = false, onNavigate }: { items: NavItem[]; vertical?: boolean; onNavigate?: () => void }) {
  return (
    <ul className={cn('flex', vertical ? 'flex-col gap-1' : 'items-center gap-1')}>
      {items.map((item) => (
        <li key={item.to}>
          <NavLink
            to={item.to}
            onClick={onNavigate}
            className={({ isActive }) =>
              cn(
                'block rounded-md px-3 font-medium transition-colors',
                vertical ? 'py-2.5 text-base' : 'py-1.5 text-sm',
                isActive ? 'bg-straw-light/70 text-graphite shadow-[inset_0_-2px_0_#e2b94b]' : 'text-graphite-light hover:bg-paper-dark hover:text-graphite',
              )
            }
          >
            {item.label}
          </NavLink>
        </li>
      ))}
    </ul>
  );
}
