import { useEffect, useRef } from 'react';
import { NavLink } from 'react-router-dom';
import { useAppAbility } from '../../lib/ability';
import { useSignedInUser } from '../../lib/signed-in-user';
import { navItemsFor } from '../navigation';
import { NavIcon } from './nav-icon';

const linkClasses = ({ isActive }: { isActive: boolean }) =>
  `flex flex-1 flex-col items-center gap-0.5 rounded-lg px-2 py-1.5 text-xs font-semibold lg:flex-none lg:flex-row lg:gap-3 lg:px-3 lg:py-2.5 lg:text-base ${
    isActive ? 'bg-brand-50 text-brand-800 lg:border-l-4 lg:border-brand-600' : 'text-ink-700 hover:bg-surface-100'
  }`;

/**
 * Keeps the page's scroll padding (app.css) as tall as the bottom bar, so focus never hides under it: the bar grows
 * when its labels wrap at 200 % zoom. The size comes from the ResizeObserver's entry, which is measured after layout,
 * and is written to the root's own scroll-padding-bottom, which nothing inherits: reading the bar's box during
 * rendering, or changing a custom property on the root, made the browser lay the whole page out twice before its
 * first paint.
 */
function useBottomMenuHeight() {
  const nav = useRef<HTMLElement>(null);
  useEffect(() => {
    const element = nav.current;
    if (!element || typeof ResizeObserver === 'undefined') return;
    const root = document.documentElement;
    // From 1024 px the menu is a side column and app.css sets no padding.
    const wide = typeof window.matchMedia === 'function' ? window.matchMedia('(min-width: 64rem)') : undefined;
    let height: number | undefined;
    const publish = () => {
      if (wide?.matches || height === undefined) root.style.removeProperty('scroll-padding-bottom');
      else root.style.setProperty('scroll-padding-bottom', `calc(${height}px + 0.75rem)`);
    };
    const observer = new ResizeObserver(([entry]) => {
      const next = entry?.borderBoxSize?.[0]?.blockSize ?? entry?.contentRect.height;
      if (next === undefined || next === height) return;
      height = next;
      publish();
    });
    observer.observe(element);
    wide?.addEventListener('change', publish);
    return () => {
      observer.disconnect();
      wide?.removeEventListener('change', publish);
      root.style.removeProperty('scroll-padding-bottom');
    };
  }, []);
  return nav;
}

/** One list of links: a bottom bar on phones, a side column on wide screens. */
export function MainNav() {
  const user = useSignedInUser();
  const ability = useAppAbility();
  const items = navItemsFor(user.role, ability);
  const nav = useBottomMenuHeight();
  return (
    <nav
      ref={nav}
      aria-label="Main"
      className="fixed inset-x-0 bottom-0 z-40 border-t border-surface-200 bg-surface-0 px-2 pb-[env(safe-area-inset-bottom)] lg:static lg:w-60 lg:shrink-0 lg:border-t-0 lg:border-r lg:bg-transparent lg:px-3 lg:py-6"
    >
      <ul className="flex gap-1 py-1 lg:flex-col">
        {items.map((item) => (
          <li key={item.to} className="flex flex-1 lg:flex-none">
            <NavLink to={item.to} end={items.some((other) => other.to.startsWith(`${item.to}/`))} className={linkClasses}>
              <NavIcon name={item.icon} />
              <span className="text-center lg:text-left">{item.label}</span>
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}
