"use client";
// The API reference: the served OpenAPI document rendered by RapiDoc, a web component bundled from
// node_modules (so nothing is fetched from outside; its own web-font loading is switched off) and
// themed with the app's colours and faces. RapiDoc is made and destroyed in an effect, like Monaco.
import { useEffect, useRef, useState } from "react";
import { ErrorState, LoadingRows } from "@/components/ui/states";

/** The app's palette (app/globals.css), for a component whose styles live in its shadow DOM. */
const theme = {
  theme: "light",
  "bg-color": "#ffffff",
  "text-color": "#16212b",
  "header-color": "#112029",
  "primary-color": "#127673",
  "nav-bg-color": "#112029",
  "nav-text-color": "#e6ecef",
  "nav-hover-bg-color": "#1c303c",
  "nav-hover-text-color": "#ffffff",
  "nav-accent-color": "#7cc3bd",
} as const;

const behaviour = {
  "spec-url": "/api/openapi.json",
  "render-style": "focused",
  layout: "row",
  "schema-style": "tree",
  "schema-expand-level": "2",
  "default-schema-tab": "schema",
  "show-header": "false",
  "show-info": "true",
  "show-components": "true",
  "allow-spec-url-load": "false",
  "allow-spec-file-load": "false",
  "allow-server-selection": "false",
  "allow-authentication": "true",
  "persist-auth": "false",
  "allow-try": "true",
  "update-route": "false",
  "load-fonts": "false",
  "use-path-in-nav-bar": "false",
  "nav-item-spacing": "compact",
  "font-size": "default",
} as const;

export function ApiReference() {
  const host = useRef<HTMLDivElement>(null);
  const mono = useRef<HTMLElement>(null);
  const [state, setState] = useState<"loading" | "ready" | { problem: string }>("loading");

  useEffect(() => {
    let element: HTMLElement | null = null;
    let cancelled = false;
    import("rapidoc")
      .then(() => {
        const container = host.current;
        if (cancelled || !container) return;
        element = document.createElement("rapi-doc");
        for (const [name, value] of Object.entries({ ...theme, ...behaviour })) element.setAttribute(name, value);
        // The app's own faces (public/fonts through next/font), read from the page so the hashed family names match.
        element.setAttribute("regular-font", getComputedStyle(container).fontFamily);
        if (mono.current) element.setAttribute("mono-font", getComputedStyle(mono.current).fontFamily);
        element.setAttribute("server-url", window.location.origin);
        element.setAttribute("default-api-server", window.location.origin);
        element.style.width = "100%";
        element.style.height = "100%";
        container.appendChild(element);
        setState("ready");
      })
      .catch((error: unknown) => {
        if (!cancelled) setState({ problem: error instanceof Error ? error.message : String(error) });
      });
    return () => {
      cancelled = true;
      element?.remove();
    };
  }, []);

  return (
    <div className="flex flex-col gap-3">
      <code ref={mono} aria-hidden className="hidden font-mono" />
      {state === "loading" ? <LoadingRows label="Loading the API reference" /> : null}
      {typeof state === "object" ? <ErrorState title="The API reference could not be shown" message={`${state.problem} The document itself is at /api/openapi.json.`} /> : null}
      <div ref={host} data-testid="api-reference" className="h-[calc(100vh-15rem)] min-h-[32rem] overflow-hidden rounded-lg border border-rule bg-panel font-sans shadow-sm" />
    </div>
  );
}
