namespace Tessel.Output.Report;

/// <summary>The report's CSS, inlined: system fonts only, so nothing is fetched.</summary>
internal static class ReportStyleSheet
{
    public const string Css = """
:root { --ink: #23232a; --muted: #66666e; --paper: #fbfaf6; --card: #ffffff; --rule: #dedad0; --accent: #1c5870; --warn: #8a4b0f; --warn-bg: #fbf0dc; }
* { box-sizing: border-box; }
body { margin: 0; background: var(--paper); color: var(--ink); font: 15px/1.45 system-ui, -apple-system, "Segoe UI", Roboto, "DejaVu Sans", sans-serif; }
header { padding: 22px 32px 14px; border-bottom: 3px solid var(--accent); background: var(--card); }
header h1 { margin: 0 0 4px; font-size: 24px; font-weight: 600; }
header p { margin: 0; color: var(--muted); max-width: 70em; }
main { padding: 18px 32px 40px; display: grid; gap: 18px; grid-template-columns: minmax(0, 3fr) minmax(0, 2fr); }
section { background: var(--card); border: 1px solid var(--rule); border-radius: 6px; padding: 14px 18px; }
section h2 { margin: 0 0 10px; font-size: 16px; font-weight: 600; color: var(--accent); text-transform: lowercase; letter-spacing: 0.02em; }
.wide { grid-column: 1 / -1; }
.side { display: flex; flex-direction: column; gap: 18px; }
#tessel-viewer { width: 100%; max-width: 720px; height: auto; border: 1px solid var(--rule); border-radius: 4px; cursor: grab; touch-action: none; display: block; }
.controls { display: flex; flex-wrap: wrap; gap: 12px; align-items: center; margin-top: 10px; font-size: 14px; }
.controls input[type=range] { flex: 1 1 220px; }
.hint { color: var(--muted); font-size: 13px; margin: 6px 0 0; }
table { border-collapse: collapse; width: 100%; font-size: 14px; }
td { padding: 5px 8px; border-bottom: 1px solid var(--rule); vertical-align: top; }
td:last-child { text-align: right; font-variant-numeric: tabular-nums; overflow-wrap: anywhere; }
td:first-child { width: 38%; }
.warnings { background: var(--warn-bg); border-color: #e6c891; }
.warnings h2 { color: var(--warn); }
ul { margin: 0; padding-left: 1.2em; }
li { margin: 3px 0; }
.figures { display: grid; gap: 16px; grid-template-columns: repeat(auto-fit, minmax(420px, 1fr)); }
.thumbs { display: flex; flex-wrap: wrap; gap: 16px; }
.thumbs figure { flex: 0 1 auto; }
figure { margin: 0; }
figure img { max-width: 100%; height: auto; border: 1px solid var(--rule); border-radius: 4px; display: block; }
figcaption { font-size: 13px; color: var(--muted); margin-top: 4px; }
.none { color: var(--muted); font-style: italic; }
#selftest { white-space: pre-wrap; word-break: break-all; margin: 0; padding: 6px 32px; font-size: 12px; }
#selftest:empty { display: none; }
@media (max-width: 900px) { main { grid-template-columns: minmax(0, 1fr); } }
""";
}
