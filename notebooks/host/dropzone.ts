// Browser only: a drop target for a log folder (or its files), plus a folder picker for the
// keyboard. Hands over the files by name (camera.json, boxes.csv, ...). An analysis file dropped
// here is refused with a message: it belongs to the page, not to the log.
import { looksLikeAnalysis } from './pageDrop.js';

/** Log files that are JSON by the flight-log layout; any other JSON file is checked for an analysis. */
const LOG_JSON = new Set(['camera.json', 'filter.json']);

async function analysisAmong(files: readonly File[]): Promise<File | null> {
  for (const f of files) {
    if (!f.name.toLowerCase().endsWith('.json') || LOG_JSON.has(f.name)) continue;
    if (looksLikeAnalysis(await f.text())) return f;
  }
  return null;
}

export function renderDropzone(text: string, onFilesChecked: (files: Map<string, File>) => void): HTMLElement {
  const zone = document.createElement('div');
  zone.className = 'dropzone';
  zone.innerHTML = `<p></p><button type="button">Choose a log folder…</button><p class="message" role="alert" hidden></p>`;
  zone.querySelector('p')!.textContent = text;
  const said = zone.querySelector<HTMLElement>('.message')!;
  const onFiles = (files: Map<string, File>): void => {
    void analysisAmong([...files.values()]).then((analysis) => {
      said.hidden = analysis === null;
      said.textContent = analysis === null ? '' : `${analysis.name} is an analysis file, not part of a flight log, so the log was not replaced. To open it, drop it anywhere else on the page or use "Open analysis…".`;
      if (analysis === null) onFilesChecked(files);
    });
  };
  const picker = document.createElement('input');
  picker.type = 'file';
  picker.multiple = true;
  picker.hidden = true;
  picker.setAttribute('webkitdirectory', '');
  picker.id = 'log-folder';
  zone.append(picker);
  zone.querySelector('button')!.addEventListener('click', () => picker.click());
  picker.addEventListener('change', () => {
    if (picker.files) onFiles(new Map([...picker.files].map((f) => [f.name, f])));
  });
  zone.addEventListener('dragover', (event) => {
    event.preventDefault();
    zone.classList.add('over');
  });
  zone.addEventListener('dragleave', () => zone.classList.remove('over'));
  zone.addEventListener('drop', (event) => {
    event.preventDefault();
    event.stopPropagation();
    zone.classList.remove('over');
    const items = [...(event.dataTransfer?.items ?? [])];
    const entries = items.map((i) => i.webkitGetAsEntry()).filter((e): e is FileSystemEntry => e !== null);
    // A dropped folder comes as entries; plain dropped files may come without them.
    const plain = [...(event.dataTransfer?.files ?? [])];
    if (entries.length === 0) onFiles(new Map(plain.map((f) => [f.name, f])));
    else collect(entries).then((files) => onFiles(new Map(files.map((f) => [f.name, f]))));
  });
  return zone;
}

async function collect(entries: FileSystemEntry[]): Promise<File[]> {
  const files: File[] = [];
  for (const entry of entries) {
    if (entry.isFile) files.push(await new Promise<File>((resolve, reject) => (entry as FileSystemFileEntry).file(resolve, reject)));
    else if (entry.isDirectory) {
      const reader = (entry as FileSystemDirectoryEntry).createReader();
      // readEntries returns batches until an empty one.
      for (;;) {
        const batch = await new Promise<FileSystemEntry[]>((resolve, reject) => reader.readEntries(resolve, reject));
        if (batch.length === 0) break;
        files.push(...(await collect(batch)));
      }
    }
  }
  return files;
}
