"use client";
// The scene header's fork controls: "Fork" where the caller may put a fork somewhere (any study,
// in any of their teams, where they edit scenes), and on a fork whose origin they may open,
// "Compare with origin".
import Link from "next/link";
import { useState } from "react";
import { Button, buttonClasses } from "@/components/ui/button";
import { useForkTargets, useLineage } from "@/lib/client/fork-queries";
import type { SceneRecord } from "@/lib/http/api-types";
import { ForkDialog } from "./fork-dialog";

export function ForkActions({ scene }: { scene: SceneRecord }) {
  const targets = useForkTargets();
  const lineage = useLineage(scene.forkedFromSceneId ? scene.id : null);
  const [open, setOpen] = useState(false);
  const list = targets.data?.targets ?? [];
  const origin = lineage.data?.origins[0]?.scene;

  return (
    <div className="flex flex-wrap items-center gap-2">
      {origin ? (
        <span className="text-sm text-muted" data-testid="forked-from">
          Fork of{" "}
          {origin.access === "open" ? (
            <Link href={`/studies/${origin.studyId}/scenes/${origin.sceneId}`} className="text-tide-700 hover:underline">
              {origin.name}
            </Link>
          ) : origin.access === "other-team" ? (
            "a scene in another team"
          ) : (
            "a deleted scene"
          )}
          {scene.forkedFromVersion !== null ? `, version ${scene.forkedFromVersion}` : ""}
        </span>
      ) : null}
      {origin?.access === "open" ? (
        <Link href={`/studies/${scene.studyId}/scenes/${scene.id}/compare`} className={buttonClasses("secondary", "sm")} data-testid="compare-with-origin">
          Compare with origin
        </Link>
      ) : null}
      {list.length > 0 ? (
        <Button size="sm" variant="secondary" onClick={() => setOpen(true)} data-testid="fork-scene">
          Fork…
        </Button>
      ) : null}
      {open ? <ForkDialog origin={scene} targets={list} onClose={() => setOpen(false)} /> : null}
    </div>
  );
}
