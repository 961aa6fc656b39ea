"use client";

import { loader } from "@monaco-editor/react";
import * as monaco from "monaco-editor";
import profileSchema from "@/schemas/cooling-profile.schema.json";

/** The model URI the profile schema is bound to (fileMatch). */
export const PROFILE_MODEL_URI = "inmemory://loopkeeper/profile.json";

let done = false;

/**
 * Monaco from the installed package (never a CDN), its workers bundled from the same
 * package, and the profile JSON Schema registered so the editor completes property
 * names and shows each property's description on hover.
 */
export function setupMonaco(): typeof monaco {
  if (done) return monaco;
  done = true;
  self.MonacoEnvironment = {
    getWorker(_id: string, label: string) {
      if (label === "json") return new Worker(new URL("monaco-editor/language/json/json.worker.js", import.meta.url), { type: "module" });
      return new Worker(new URL("monaco-editor/editor/editor.worker.js", import.meta.url), { type: "module" });
    },
  };
  loader.config({ monaco });
  monaco.json.jsonDefaults.setDiagnosticsOptions({
    // Markers come from the engine alone (one source of truth); the schema still drives completion and hover.
    validate: false,
    allowComments: false,
    enableSchemaRequest: false,
    schemas: [{ uri: profileSchema.$id, fileMatch: [PROFILE_MODEL_URI, "*.profile.json"], schema: profileSchema }],
  });
  // Only what the editor uses from the JSON worker: completion and hover from the schema, the
  // outline and formatting on command. Left out, because each would send every edit to the worker:
  // its diagnostics (with validation off it still ran 500 ms after each edit and cleared markers,
  // redrawing them), colour swatches, and folding ranges (the editor folds by indentation).
  monaco.json.jsonDefaults.setModeConfiguration({
    documentFormattingEdits: true,
    documentRangeFormattingEdits: true,
    completionItems: true,
    hovers: true,
    documentSymbols: true,
    tokens: true,
    colors: false,
    foldingRanges: false,
    diagnostics: false,
    selectionRanges: true,
  });
  return monaco;
}
