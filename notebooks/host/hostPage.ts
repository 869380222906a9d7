// The host page's HTML (served at / by the notebook server). The page itself is built by
// dist/notebooks/app.js; styles are inline so page and report share one stylesheet.
import { PAGE_CSS } from './styles.js';

export function hostPageHtml(): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>alight studies</title>
<link rel="icon" href="data:,">
<style>${PAGE_CSS}</style>
</head>
<body data-state="loading">
<div id="app"><p style="padding:20px">Loading the studies…</p></div>
<script type="module" src="/app.js"></script>
</body>
</html>
`;
}
