"use client";
import { useState } from "react";

/**
 * The header's links and account controls. From the md breakpoint up they sit in one row; on a phone they fold
 * behind a "Menu" button (aria-expanded) and open as a column under the header. Following a link closes it.
 */
export function SiteMenu({ children }: { children: React.ReactNode }) {
  const [open, setOpen] = useState(false);
  return (
    <>
      <button
        type="button"
        className="rounded border border-stone-300 px-3 py-1 text-sm md:hidden"
        aria-expanded={open}
        aria-controls="site-menu"
        onClick={() => setOpen((o) => !o)}
      >
        <span aria-hidden="true">{open ? "✕ " : "☰ "}</span>Menu
      </button>
      <div
        id="site-menu"
        className={`${open ? "flex" : "hidden"} w-full flex-col gap-3 border-t border-stone-200 pt-3 md:flex md:w-auto md:flex-1 md:flex-row md:items-center md:justify-between md:gap-6 md:border-0 md:pt-0`}
        onClick={(e) => {
          if ((e.target as HTMLElement).closest("a")) setOpen(false);
        }}
      >
        {children}
      </div>
    </>
  );
}
