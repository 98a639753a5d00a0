"use client";
// "Save finished runs automatically": a choice of this browser, kept in localStorage and shared by
// every open run panel (and other tabs, through the storage event).
import { useCallback, useSyncExternalStore } from "react";

const storageKey = "rarefact:save-finished-runs";
const listeners = new Set<() => void>();

function read(): boolean {
  try {
    return window.localStorage.getItem(storageKey) === "yes";
  } catch {
    // Storage refused (private mode, policy): the choice is simply not remembered.
    return false;
  }
}

function subscribe(listener: () => void): () => void {
  listeners.add(listener);
  const onStorage = (event: StorageEvent) => {
    if (event.key === storageKey) listener();
  };
  window.addEventListener("storage", onStorage);
  return () => {
    listeners.delete(listener);
    window.removeEventListener("storage", onStorage);
  };
}

export function useAutoSaveRuns(): [boolean, (value: boolean) => void] {
  const value = useSyncExternalStore(subscribe, read, () => false);
  const set = useCallback((next: boolean) => {
    try {
      window.localStorage.setItem(storageKey, next ? "yes" : "no");
    } catch {
      // Not remembered; nothing else to do.
    }
    listeners.forEach((listener) => listener());
  }, []);
  return [value, set];
}
