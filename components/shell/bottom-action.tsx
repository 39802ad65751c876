// The page's primary action: on a phone it sits at the bottom of the screen just above the tab bar, within
// thumb reach; from the small breakpoint up it stays in the page flow.
import type { ReactNode } from "react";

export function BottomAction({ children }: { children: ReactNode }) {
  return (
    <>
      {/* Keeps the end of the page scrollable above the fixed action on a phone. */}
      <div aria-hidden="true" className="h-16 sm:hidden" />
      <div className="fixed inset-x-0 bottom-[calc(var(--app-bottom-nav)+env(safe-area-inset-bottom))] z-10 border-t border-line bg-canvas px-gutter py-3 sm:static sm:border-0 sm:bg-transparent sm:p-0">
        {children}
      </div>
    </>
  );
}
