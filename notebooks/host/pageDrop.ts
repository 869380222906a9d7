// Browser only: files dropped anywhere on the page (outside a study's own drop zone). An analysis
// file opens; anything else is refused with a message. The browser never navigates to the file.

/** Does this JSON text look like an analysis file (an object naming a study)? */
export function looksLikeAnalysis(text: string): boolean {
  try {
    const value = JSON.parse(text) as unknown;
    return value !== null && typeof value === 'object' && !Array.isArray(value) && 'study' in value;
  } catch {
    return false;
  }
}

/** A JSON object with a scenario's version field, or text that fails to parse as JSON (the validator then says where). */
export function looksLikeScenario(text: string): boolean {
  try {
    const value = JSON.parse(text) as unknown;
    return value !== null && typeof value === 'object' && !Array.isArray(value) && ('version' in value || 'carrier' in value);
  } catch {
    return true;
  }
}

export function listenForPageDrops(open: (file: File) => void): void {
  // Without preventDefault on both events the browser opens the dropped file itself, leaving the page.
  window.addEventListener('dragover', (event) => {
    event.preventDefault();
    if (event.dataTransfer) event.dataTransfer.dropEffect = 'copy';
  });
  window.addEventListener('drop', (event) => {
    event.preventDefault();
    // A study's own drop zone (the replay's log folder) handles its drops itself.
    if ((event.target as Element | null)?.closest?.('.dropzone')) return;
    const file = event.dataTransfer?.files?.[0];
    if (file) open(file);
  });
}
