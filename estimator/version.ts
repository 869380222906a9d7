// The tool version written into analysis files and results; bump with package.json.
export const VERSION = '0.1.0';
