"use client";

import { useSyncExternalStore } from "react";

// The theme lives on <html class="dark"> (set before first paint by the root layout's script).
function subscribe(onChange: () => void) {
  const observer = new MutationObserver(onChange);
  observer.observe(document.documentElement, { attributes: true, attributeFilter: ["class"] });
  return () => observer.disconnect();
}
const isDark = () => document.documentElement.classList.contains("dark");

export function ThemeToggle() {
  const dark = useSyncExternalStore(subscribe, isDark, () => false);

  function toggle() {
    const next = !isDark();
    document.documentElement.classList.toggle("dark", next);
    localStorage.setItem("keelson-theme", next ? "dark" : "light");
  }

  return (
    <button
      type="button"
      onClick={toggle}
      className="btn-quiet px-2"
      aria-pressed={dark}
      title="Switch between the day and the night theme"
    >
      <span aria-hidden="true">{dark ? "☾" : "☀"}</span>
      <span className="sr-only sm:not-sr-only">{dark ? "Night" : "Day"}</span>
    </button>
  );
}
