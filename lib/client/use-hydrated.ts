"use client";
// True once React has hydrated the page in the browser. Forms keep their submit button disabled until
// then: a click before hydration would submit the form natively, with its fields in the URL.
import { useSyncExternalStore } from "react";

const subscribe = () => () => {};

export function useHydrated(): boolean {
  return useSyncExternalStore(
    subscribe,
    () => true,
    () => false,
  );
}
