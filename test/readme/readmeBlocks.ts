// Fenced code blocks of a Markdown text, and the commands of a shell block.

export interface CodeBlock {
  /** Fence info: language, then words ("sh norun"). */
  lang: string;
  /** True for a block fenced ```sh norun: shown to readers, not run by the README test. */
  norun: boolean;
  /** 1-based line of the opening fence. */
  line: number;
  text: string;
}

export function readmeBlocks(markdown: string): CodeBlock[] {
  const lines = markdown.split('\n');
  const blocks: CodeBlock[] = [];
  for (let i = 0; i < lines.length; i++) {
    const open = /^```(\S*)(.*)$/.exec(lines[i]!);
    if (!open) continue;
    const start = i;
    const body: string[] = [];
    for (i++; i < lines.length && !/^```\s*$/.test(lines[i]!); i++) body.push(lines[i]!);
    blocks.push({ lang: open[1]!, norun: /\bnorun\b/.test(open[2]!), line: start + 1, text: body.join('\n') + '\n' });
  }
  return blocks;
}

/** The commands of a shell text: continuation lines joined, comments and blank lines dropped. */
export function shellCommands(text: string): string[] {
  return text
    .replace(/\\\n\s*/g, ' ')
    .split('\n')
    .map((l) => l.replace(/(^|\s)#.*$/, '').trim())
    .filter((l) => l !== '');
}
