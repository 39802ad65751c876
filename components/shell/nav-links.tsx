"use client";
// The app's navigation: a row of links in the desktop header, a bar of large tabs at the bottom on a phone.
import Link from "next/link";
import { usePathname } from "next/navigation";
import { clsx } from "clsx";

export interface NavItem {
  href: string;
  label: string;
}

function isActive(pathname: string, href: string): boolean {
  return pathname === href || pathname.startsWith(`${href}/`);
}

export function HeaderNav({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  return (
    <nav aria-label="Main" className="hidden items-center gap-1 sm:flex">
      {items.map((item) => (
        <Link
          key={item.href}
          href={item.href}
          aria-current={isActive(pathname, item.href) ? "page" : undefined}
          className="rounded px-3 py-2 text-sm font-medium text-ink-muted hover:bg-sunken hover:text-ink aria-[current=page]:bg-action-soft aria-[current=page]:text-action"
        >
          {item.label}
        </Link>
      ))}
    </nav>
  );
}

export function BottomNav({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  return (
    <nav
      aria-label="Main"
      className="fixed inset-x-0 bottom-0 z-20 border-t border-line bg-surface pb-[env(safe-area-inset-bottom)] sm:hidden"
    >
      <ul className="flex">
        {items.map((item) => (
          <li key={item.href} className="flex-1">
            <Link
              href={item.href}
              aria-current={isActive(pathname, item.href) ? "page" : undefined}
              className={clsx(
                "flex min-h-touch items-center justify-center text-sm font-medium text-ink-muted",
                "aria-[current=page]:text-action aria-[current=page]:shadow-[inset_0_2px_0_var(--pl-action)]",
              )}
            >
              {item.label}
            </Link>
          </li>
        ))}
      </ul>
    </nav>
  );
}
