"use client";
// The saved run page's pin board: the discussion publishes its pinned comments here, the field replay
// and the trace chart draw them, a chip asks them to jump to one, and in pin mode the view the user
// clicks hands a new pin back to the composer. Outside the provider (every other page) the hooks
// answer null and the views draw no pins.
import { createContext, useCallback, useContext, useEffect, useMemo, useState, type ReactNode } from "react";
import type { CommentPin, FieldPin, TracePin } from "@/lib/validation/comment";

export interface PlacedPin<Pin extends CommentPin = CommentPin> {
  commentId: string;
  /** Shown on the marker and the chip: pins are numbered in the order their comments were written. */
  number: number;
  pin: Pin;
  /** For the marker's tooltip: "Priya Raman: the 500 Hz band…". */
  title: string;
  resolved: boolean;
}

export type PinKind = CommentPin["kind"];

/** A request to show a pin; the nonce makes a second click on the same chip jump again. */
export interface PinFocus {
  commentId: string;
  nonce: number;
}

interface PinBoard {
  runId: string;
  pins: readonly PlacedPin[];
  publishPins(pins: readonly PlacedPin[]): void;
  /** The pin a chip last asked the views to show. */
  focus: PinFocus | null;
  jumpTo(commentId: string): void;
  /** The comment a marker last pointed at: the discussion scrolls to it. */
  selected: PinFocus | null;
  selectComment(commentId: string): void;
  /** Which view waits for a click to make a pin, if any. */
  picking: PinKind | null;
  startPicking(kind: PinKind): void;
  stopPicking(): void;
  /** The pin the user picked last, waiting in the composer. */
  picked: CommentPin | null;
  pick(pin: CommentPin): void;
  clearPicked(): void;
}

const PinBoardContext = createContext<PinBoard | null>(null);

export function PinBoardProvider({ runId, children }: { runId: string; children: ReactNode }) {
  const [pins, setPins] = useState<readonly PlacedPin[]>([]);
  const [focus, setFocus] = useState<PinFocus | null>(null);
  const [selected, setSelected] = useState<PinFocus | null>(null);
  const [picking, setPicking] = useState<PinKind | null>(null);
  const [picked, setPicked] = useState<CommentPin | null>(null);
  const jumpTo = useCallback((commentId: string) => setFocus((old) => ({ commentId, nonce: (old?.nonce ?? 0) + 1 })), []);
  const selectComment = useCallback((commentId: string) => setSelected((old) => ({ commentId, nonce: (old?.nonce ?? 0) + 1 })), []);
  const pick = useCallback((pin: CommentPin) => {
    setPicked(pin);
    setPicking(null);
  }, []);
  const value = useMemo<PinBoard>(
    () => ({
      runId,
      pins,
      publishPins: setPins,
      focus,
      jumpTo,
      selected,
      selectComment,
      picking,
      startPicking: setPicking,
      stopPicking: () => setPicking(null),
      picked,
      pick,
      clearPicked: () => setPicked(null),
    }),
    [runId, pins, focus, jumpTo, selected, selectComment, picking, picked, pick],
  );
  // Escape leaves pin mode wherever the focus is.
  useEffect(() => {
    if (!picking) return;
    const onKey = (event: KeyboardEvent) => {
      if (event.key === "Escape") setPicking(null);
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [picking]);
  return <PinBoardContext.Provider value={value}>{children}</PinBoardContext.Provider>;
}

/** The whole board, for the discussion; null outside the saved run page. */
export function usePinBoard(): PinBoard | null {
  return useContext(PinBoardContext);
}

function isFieldPin(placed: PlacedPin): placed is PlacedPin<FieldPin> {
  return placed.pin.kind === "field";
}

function isTracePin(placed: PlacedPin): placed is PlacedPin<TracePin> {
  return placed.pin.kind === "trace";
}

/** What the field replay needs: its pins, the one to jump to, and pin mode. Null outside the provider. */
export function useFieldPins() {
  const board = usePinBoard();
  return useMemo(() => {
    if (!board) return null;
    const pins = board.pins.filter(isFieldPin);
    const focused = board.focus ? pins.find((placed) => placed.commentId === board.focus!.commentId) : undefined;
    return { pins, focus: focused && board.focus ? { placed: focused, nonce: board.focus.nonce } : null, picking: board.picking === "field", pick: board.pick, stopPicking: board.stopPicking, selectComment: board.selectComment };
  }, [board]);
}

/** What the trace chart needs, for the receivers it draws. Null outside the provider. */
export function useTracePins() {
  const board = usePinBoard();
  return useMemo(() => {
    if (!board) return null;
    const pins = board.pins.filter(isTracePin);
    const focused = board.focus ? pins.find((placed) => placed.commentId === board.focus!.commentId) : undefined;
    return { runId: board.runId, pins, focus: focused && board.focus ? { placed: focused, nonce: board.focus.nonce } : null, picking: board.picking === "trace", pick: board.pick, stopPicking: board.stopPicking, selectComment: board.selectComment };
  }, [board]);
}

/**
 * Adds a pinned receiver to the analysis's chosen receivers when a chip jumps to it, so the trace
 * chart can show the pin. A no-op outside the provider.
 */
export function useRevealPinnedReceiver(receiverIds: readonly string[], setReceiverIds: (ids: string[]) => void, available: readonly string[]): void {
  const board = usePinBoard();
  const focus = board?.focus ?? null;
  const pins = board?.pins;
  useEffect(() => {
    if (!focus || !pins) return;
    const placed = pins.find((candidate) => candidate.commentId === focus.commentId);
    if (placed?.pin.kind !== "trace") return;
    const receiverId = placed.pin.receiverId;
    if (!receiverIds.includes(receiverId) && available.includes(receiverId)) setReceiverIds([...receiverIds, receiverId]);
    // Only a new jump should add a receiver; later choices in the picker stay the user's.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [focus]);
}
