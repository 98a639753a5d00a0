"use client";
// The fork dialog: where the fork goes (this study, or another study the caller edits, grouped by
// team), its name and which version of this scene it copies. A refused fork keeps every choice
// and shows the server's message beside the field it names.
import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useEffect, useId, useRef, type KeyboardEvent as ReactKeyboardEvent } from "react";
import { createPortal } from "react-dom";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { Button } from "@/components/ui/button";
import { FieldFrame, TextField } from "@/components/ui/text-field";
import { ErrorState } from "@/components/ui/states";
import { ApiError } from "@/lib/client/api";
import { useForkScene } from "@/lib/client/fork-queries";
import { useSceneVersions } from "@/lib/client/queries";
import type { SceneRecord } from "@/lib/http/api-types";
import type { ForkTarget } from "@/lib/http/fork-types";
import { defaultForkName, forkFormSchema } from "@/lib/validation/fork";

type ForkFormValues = z.input<typeof forkFormSchema>;
const fieldNames = ["targetStudyId", "name", "fromVersion"] as const;

const selectClasses = "h-10 w-full rounded-md border border-rule-strong bg-panel px-3 text-[15px] text-ink focus:border-tide-500 focus:outline-none focus:ring-2 focus:ring-tide-500/20";

/** Targets grouped by team, the origin's team first, so "another study of ours" is near the top. */
function groupByTeam(targets: readonly ForkTarget[], originTeamId: string): { teamId: string; teamName: string; studies: ForkTarget[] }[] {
  const groups = new Map<string, { teamId: string; teamName: string; studies: ForkTarget[] }>();
  for (const target of targets) {
    const group = groups.get(target.teamId) ?? { teamId: target.teamId, teamName: target.teamName, studies: [] };
    group.studies.push(target);
    groups.set(target.teamId, group);
  }
  return [...groups.values()].sort((a, b) => Number(b.teamId === originTeamId) - Number(a.teamId === originTeamId));
}

export function ForkDialog({ origin, targets, onClose }: { origin: SceneRecord; targets: readonly ForkTarget[]; onClose: () => void }) {
  const router = useRouter();
  const forkScene = useForkScene(origin.id, origin.studyId);
  const versions = useSceneVersions(origin.id);
  const titleId = useId();
  const dialog = useRef<HTMLFormElement>(null);
  const canForkHere = targets.some((target) => target.studyId === origin.studyId);
  const elsewhere = groupByTeam(
    targets.filter((target) => target.studyId !== origin.studyId),
    origin.teamId,
  );
  const form = useForm<ForkFormValues, unknown, z.output<typeof forkFormSchema>>({
    resolver: zodResolver(forkFormSchema),
    defaultValues: { targetStudyId: canForkHere ? origin.studyId : (targets[0]?.studyId ?? ""), name: defaultForkName(origin.name), fromVersion: String(origin.version) },
  });
  const { errors, isSubmitting } = form.formState;

  // Focus moves into the dialog on opening and back to the Fork button on closing.
  useEffect(() => {
    const before = document.activeElement instanceof HTMLElement ? document.activeElement : null;
    dialog.current?.querySelector<HTMLElement>("select, input")?.focus();
    return () => before?.focus();
  }, []);

  const onKeyDown = (event: ReactKeyboardEvent<HTMLElement>) => {
    if (event.key === "Escape" && !isSubmitting) {
      event.preventDefault();
      onClose();
    }
  };

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      const { scene } = await forkScene.mutateAsync(values);
      router.push(`/studies/${scene.studyId}/scenes/${scene.id}`);
    } catch (error) {
      if (error instanceof ApiError && error.issues.length > 0) {
        for (const issue of error.issues) form.setError(fieldNames.find((name) => name === issue.path) ?? "root", { message: issue.message });
      } else {
        form.setError("root", { message: error instanceof Error ? error.message : "The scene could not be forked." });
      }
    }
  });

  return createPortal(
    <div className="fixed inset-0 z-50 flex items-start justify-center overflow-y-auto bg-night/35 px-4 py-[10vh]" onMouseDown={(event) => event.target === event.currentTarget && !isSubmitting && onClose()}>
      <form
        ref={dialog}
        role="dialog"
        aria-modal="true"
        aria-labelledby={titleId}
        onKeyDown={onKeyDown}
        onSubmit={onSubmit}
        noValidate
        className="flex w-full max-w-[32rem] flex-col gap-4 rounded-lg border border-rule bg-panel p-5 shadow-[0_18px_48px_-16px_rgba(17,32,41,0.45)]"
      >
        <div>
          <h2 id={titleId} className="text-[15px] font-semibold text-ink">
            Fork “{origin.name}”
          </h2>
          <p className="mt-1 text-[13px] text-muted">The fork starts as a copy of one version of this scene and remembers where it came from. Changes to either do not reach the other.</p>
        </div>

        <FieldFrame id="fork-target" label="Put the fork in" error={errors.targetStudyId?.message}>
          <select id="fork-target" className={selectClasses} aria-invalid={errors.targetStudyId ? true : undefined} {...form.register("targetStudyId")}>
            {canForkHere ? <option value={origin.studyId}>This study (as a variant)</option> : null}
            {elsewhere.map((group) => (
              <optgroup key={group.teamId} label={group.teamId === origin.teamId ? `Other studies of ${group.teamName}` : group.teamName}>
                {group.studies.map((target) => (
                  <option key={target.studyId} value={target.studyId}>
                    {target.studyTitle}
                  </option>
                ))}
              </optgroup>
            ))}
          </select>
        </FieldFrame>

        <TextField id="fork-name" label="Name of the fork" error={errors.name?.message} {...form.register("name")} />

        <FieldFrame id="fork-version" label="Copy version" error={errors.fromVersion?.message} hint={versions.isError ? "The history could not be loaded; the current version is copied." : undefined}>
          <select id="fork-version" className={selectClasses} aria-invalid={errors.fromVersion ? true : undefined} {...form.register("fromVersion")}>
            {(versions.data?.versions ?? [{ version: origin.version, authorName: null, note: "", createdAt: "" }]).map((item) => (
              <option key={item.version} value={String(item.version)}>
                {item.version === origin.version ? `Version ${item.version} (current)` : `Version ${item.version}`}
                {item.authorName ? ` · ${item.authorName}` : ""}
                {item.note ? ` · ${item.note}` : ""}
              </option>
            ))}
          </select>
        </FieldFrame>

        {errors.root ? <ErrorState title="The scene was not forked" message={errors.root.message ?? ""} /> : null}
        <div className="flex justify-end gap-3">
          <Button variant="secondary" onClick={onClose} disabled={isSubmitting}>
            Cancel
          </Button>
          <Button type="submit" disabled={isSubmitting}>
            {isSubmitting ? "Forking…" : "Fork scene"}
          </Button>
        </div>
      </form>
    </div>,
    document.body,
  );
}
