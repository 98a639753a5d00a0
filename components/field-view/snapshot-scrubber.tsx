"use client";
// Time scrubber with play/pause over a run's pressure snapshots. Controlled: the parent holds the index and
// the playing flag and passes the chosen snapshot to FieldView. Playback advances on animation frames at
// `snapshotsPerSecond`, so the field view redraws at most once per display frame.
import { useEffect, useRef } from "react";

import { formatMilliseconds } from "./format";

export interface SnapshotScrubberProps {
  /** The snapshots' times (s) and steps, in order. */
  snapshots: readonly { time: number; step: number }[];
  index: number;
  onIndexChange: (index: number) => void;
  playing: boolean;
  onPlayingChange: (playing: boolean) => void;
  /** Playback rate; 30 shows a 100-snapshot run in about 3 s. */
  snapshotsPerSecond?: number;
  /** Start again from the first snapshot at the end instead of stopping. */
  loop?: boolean;
  className?: string;
}

export function SnapshotScrubber({ snapshots, index, onIndexChange, playing, onPlayingChange, snapshotsPerSecond = 30, loop = false, className = "" }: SnapshotScrubberProps) {
  const count = snapshots.length;
  const last = Math.max(0, count - 1);
  const current = snapshots[Math.min(Math.max(0, index), last)];
  // The loop reads the latest index and callbacks without restarting on every frame.
  const latest = useRef({ index, onIndexChange, onPlayingChange });
  useEffect(() => {
    latest.current = { index, onIndexChange, onPlayingChange };
  });

  useEffect(() => {
    if (!playing || count < 2) return;
    let frame = 0;
    let previous: number | undefined;
    let carried = 0;
    const tick = (now: number) => {
      if (previous !== undefined) {
        carried += ((now - previous) / 1000) * snapshotsPerSecond;
        const advance = Math.floor(carried);
        if (advance > 0) {
          carried -= advance;
          const next = latest.current.index + advance;
          if (next > last && !loop) {
            latest.current.onIndexChange(last);
            latest.current.onPlayingChange(false);
            return;
          }
          latest.current.onIndexChange(next > last ? next % count : next);
        }
      }
      previous = now;
      frame = requestAnimationFrame(tick);
    };
    frame = requestAnimationFrame(tick);
    return () => cancelAnimationFrame(frame);
  }, [playing, count, last, loop, snapshotsPerSecond]);

  return (
    <div className={`flex items-center gap-3 ${className}`}>
      <button
        type="button"
        aria-label={playing ? "Pause" : "Play"}
        disabled={count < 2}
        onClick={() => {
          // Play from the start when the end has been reached.
          if (!playing && index >= last) onIndexChange(0);
          onPlayingChange(!playing);
        }}
        className="inline-flex size-8 shrink-0 items-center justify-center rounded-md border border-rule-strong bg-panel text-ink-soft transition-colors hover:border-ink-soft hover:bg-paper disabled:cursor-not-allowed disabled:text-muted/60"
      >
        {playing ? (
          <svg aria-hidden viewBox="0 0 16 16" className="size-3.5" fill="currentColor">
            <rect x="3.5" y="3" width="3" height="10" rx="0.5" />
            <rect x="9.5" y="3" width="3" height="10" rx="0.5" />
          </svg>
        ) : (
          <svg aria-hidden viewBox="0 0 16 16" className="size-3.5" fill="currentColor">
            <path d="M4.5 2.8v10.4a.5.5 0 0 0 .77.42l8-5.2a.5.5 0 0 0 0-.84l-8-5.2a.5.5 0 0 0-.77.42Z" />
          </svg>
        )}
      </button>
      <input
        type="range"
        aria-label="Snapshot"
        min={0}
        max={last}
        step={1}
        value={Math.min(index, last)}
        disabled={count < 2}
        onChange={(event) => onIndexChange(Number(event.target.value))}
        className="h-1.5 min-w-0 flex-1 cursor-pointer accent-tide-600 disabled:cursor-not-allowed"
      />
      <span className="tabular w-44 shrink-0 text-right font-mono text-xs text-ink-soft">
        {current ? `t = ${formatMilliseconds(current.time)} \u00b7 ${Math.min(index, last) + 1}/${count}` : "no snapshots"}
      </span>
    </div>
  );
}
