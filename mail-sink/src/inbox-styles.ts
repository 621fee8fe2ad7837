/** The inbox page's whole stylesheet, inlined so the page needs nothing from elsewhere. */
export const INBOX_STYLES = `
:root {
  --night: #121a2c;
  --night-line: #2a3652;
  --paper: #f4f6fa;
  --panel: #ffffff;
  --ink: #1c2333;
  --muted: #5a6476;
  --line: #dbe0e8;
  --accent: #2d5bb5;
  --accent-soft: #e8eefa;
  --danger: #b0302a;
  --radius: 6px;
  color-scheme: light;
  font-family: system-ui, -apple-system, 'Segoe UI', Roboto, 'Helvetica Neue', Arial, sans-serif;
  font-size: 15px;
  line-height: 1.45;
  color: var(--ink);
  background: var(--paper);
}
* { box-sizing: border-box; }
body { margin: 0; min-height: 100vh; display: flex; flex-direction: column; }
a { color: var(--accent); }
:focus-visible { outline: 3px solid var(--accent); outline-offset: 2px; }
.visually-hidden {
  position: absolute; width: 1px; height: 1px; margin: -1px; padding: 0;
  overflow: hidden; clip: rect(0 0 0 0); white-space: nowrap; border: 0;
}
.skip-link { position: absolute; left: 0.5rem; top: -3rem; background: var(--panel); padding: 0.4rem 0.8rem; z-index: 10; }
.skip-link:focus { top: 0.5rem; }

.bar {
  display: flex; flex-wrap: wrap; align-items: center; gap: 0.75rem 1.5rem;
  padding: 0.75rem 1.25rem; background: var(--night); color: #e9edf5;
  border-bottom: 1px solid var(--night-line);
}
.brand { display: flex; align-items: center; gap: 0.6rem; margin-right: auto; }
.brand h1 { margin: 0; font-size: 1.15rem; font-weight: 600; letter-spacing: 0.01em; }
.brand-mark {
  width: 1.4rem; height: 1.4rem; border-radius: 50%;
  background: radial-gradient(circle at 30% 30%, #f6d77a 0 18%, transparent 19%),
    radial-gradient(circle at 50% 55%, #6f8fd8 0 55%, #34497c 56% 100%);
}
.bar-note { margin: 0; font-size: 0.85rem; color: #b7c0d3; }
.bar-note code { color: #e9edf5; }
.filter { display: flex; align-items: center; gap: 0.4rem; }
.filter label { font-size: 0.85rem; color: #b7c0d3; }
.filter input {
  width: 15rem; max-width: 50vw; padding: 0.35rem 0.5rem; border-radius: var(--radius);
  border: 1px solid var(--night-line); background: #1b2540; color: #f2f4f9; font: inherit;
}
.filter a { color: #c9d6f5; font-size: 0.85rem; }
button {
  font: inherit; padding: 0.35rem 0.8rem; border-radius: var(--radius);
  border: 1px solid var(--line); background: var(--panel); color: var(--ink); cursor: pointer;
}
button:hover { background: var(--accent-soft); }
.bar button { border-color: var(--night-line); background: #24304d; color: #f2f4f9; }
.bar button:hover { background: #2f3d61; }
.bar button.danger, dialog button.danger { background: var(--danger); border-color: var(--danger); color: #fff; }
.bar button.danger:hover, dialog button.danger:hover { background: #922620; }

.layout { flex: 1; display: grid; grid-template-columns: minmax(18rem, 27rem) 1fr; min-height: 0; }
.list-pane { border-right: 1px solid var(--line); background: var(--panel); overflow-y: auto; }
.list-head {
  display: flex; justify-content: space-between; align-items: baseline; gap: 1rem;
  padding: 0.6rem 1rem; border-bottom: 1px solid var(--line); color: var(--muted); font-size: 0.85rem;
}
.list-head h2 { margin: 0; font-size: 0.85rem; font-weight: 600; text-transform: uppercase; letter-spacing: 0.06em; }
.list-head p { margin: 0; }
.messages { list-style: none; margin: 0; padding: 0; }
.item {
  display: grid; gap: 0.15rem; padding: 0.65rem 1rem 0.7rem 0.85rem; text-decoration: none; color: inherit;
  border-bottom: 1px solid var(--line); border-left: 4px solid transparent;
}
.item:hover { background: #f7f9fd; }
.item[aria-current='page'] { background: var(--accent-soft); border-left-color: var(--accent); }
.item-top { display: flex; justify-content: space-between; gap: 0.75rem; font-size: 0.85rem; color: var(--muted); }
.item-from { overflow: hidden; text-overflow: ellipsis; white-space: nowrap; }
.item-top time { flex: none; }
.item-subject { font-weight: 600; overflow-wrap: anywhere; }
.item-to { font-size: 0.85rem; color: var(--muted); overflow-wrap: anywhere; }
.empty { padding: 2.5rem 1.5rem; text-align: center; color: var(--muted); }
.empty strong { display: block; color: var(--ink); font-size: 1.05rem; margin-bottom: 0.3rem; }

.detail-pane { padding: 1.25rem 1.75rem 2.5rem; overflow-y: auto; min-width: 0; }
.detail-pane:focus { outline: none; }
.placeholder { color: var(--muted); margin-top: 3rem; text-align: center; }
.notice { padding: 0.75rem 1rem; border-radius: var(--radius); background: #fff4e5; border: 1px solid #f0c98a; }
.detail-pane h2 { margin: 0 0 0.9rem; font-size: 1.35rem; overflow-wrap: anywhere; }
.detail-pane h3 { margin: 1.6rem 0 0.5rem; font-size: 0.85rem; text-transform: uppercase; letter-spacing: 0.06em; color: var(--muted); }
.meta { display: grid; grid-template-columns: max-content 1fr; gap: 0.3rem 1rem; margin: 0; }
.meta dt { color: var(--muted); }
.meta dd { margin: 0; overflow-wrap: anywhere; }
.links { display: flex; flex-wrap: wrap; gap: 0.4rem 1.25rem; list-style: none; padding: 0; margin: 1rem 0 0; font-size: 0.9rem; }
.attachments { list-style: none; margin: 0; padding: 0; display: grid; gap: 0.35rem; }
.attachments li { display: flex; flex-wrap: wrap; gap: 0.25rem 0.75rem; align-items: baseline; }
.attachments span { color: var(--muted); font-size: 0.85rem; }
.html-part {
  display: block; width: 100%; height: 32rem; resize: vertical; overflow: auto;
  border: 1px solid var(--line); border-radius: var(--radius); background: #fff;
}
.text-part, .headers {
  margin: 0; padding: 0.9rem 1rem; background: var(--panel); border: 1px solid var(--line);
  border-radius: var(--radius); white-space: pre-wrap; overflow-wrap: anywhere;
  font-family: ui-monospace, 'SFMono-Regular', Menlo, Consolas, monospace; font-size: 0.85rem;
}
details { margin-top: 1.6rem; }
summary { cursor: pointer; color: var(--muted); }
.headers { margin-top: 0.5rem; }
.headers b { font-weight: 600; }

dialog { border: 1px solid var(--line); border-radius: 10px; padding: 1.25rem 1.5rem; max-width: 28rem; color: var(--ink); }
dialog::backdrop { background: rgb(18 26 44 / 55%); }
dialog h2 { margin: 0 0 0.5rem; font-size: 1.15rem; }
dialog .actions { display: flex; justify-content: flex-end; gap: 0.6rem; margin-top: 1.25rem; }

@media (max-width: 56rem) {
  .layout { grid-template-columns: 1fr; }
  .list-pane { border-right: 0; border-bottom: 1px solid var(--line); max-height: 45vh; }
  .detail-pane { padding: 1rem; }
}
`;
