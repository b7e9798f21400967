const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };

/** Escapes text for HTML element content and quoted attribute values. */
export function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ENTITIES[c]);
}

/** A minimal standalone page for the server-rendered development tools (fake sign-in, mailbox). */
export function page(title: string, body: string): string {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)}</title>
<style>
body{font:15px/1.5 system-ui,sans-serif;max-width:46rem;margin:2rem auto;padding:0 1rem;color:#1d2330;background:#f7f7f4}
h1{font-size:1.3rem}.note{background:#fff4d6;border:1px solid #e5c66b;padding:.6rem .8rem;border-radius:4px}
button,input{font:inherit;padding:.35rem .7rem}ul{padding:0;list-style:none}li{margin:.4rem 0}
table{border-collapse:collapse;width:100%}td,th{border-bottom:1px solid #ddd;padding:.35rem;text-align:left;vertical-align:top}
pre{white-space:pre-wrap;background:#fff;border:1px solid #ddd;padding:.5rem}
</style></head><body><main>${body}</main></body></html>`;
}
