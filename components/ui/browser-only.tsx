"use client";
// What next/dynamic(…, { ssr: false }) did for the 3D views and charts, without its preload
// machinery, which put ~2 kB (gzip) of extra code in the first load of every page using it.
// The component's own chunk is fetched only in the browser, after hydration.

import { lazy, Suspense, useSyncExternalStore, type ComponentType, type ReactNode } from "react";

const noSubscription = () => () => {};

/** false while the server renders and while the page hydrates; true once it runs in the browser. */
export function useInBrowser(): boolean {
  return useSyncExternalStore(noSubscription, () => true, () => false);
}

/** A component whose code loads in the browser only; `fallback` shows until it is there. */
export function browserOnly<P extends object>(load: () => Promise<ComponentType<P>>, fallback: ReactNode): ComponentType<P> {
  const Lazy = lazy(async () => ({ default: await load() })) as unknown as ComponentType<P>;
  function BrowserOnly(props: P) {
    const inBrowser = useInBrowser();
    if (!inBrowser) return <>{fallback}</>;
    return (
      <Suspense fallback={fallback}>
        <Lazy {...props} />
      </Suspense>
    );
  }
  return BrowserOnly;
}
