//! The pages' style sheet: written for a phone first (one column, fields full width, text
//! that wraps, a wide table scrolling inside its own box) and widened from 600 px on; a calm
//! paper-and-ink look with the solar caution as the one loud block. It is the exact text of
//! the pages' `<style>` element, allowed by its SHA-256 hash in the content-security policy
//! (`security.rs`), so the pages need no `style=` attribute and no script.
//!
//! Colours are chosen for contrast: body text #1c2833 on #fbf8f1 (about 14:1), muted text
//! #4a5563 (about 7:1), links #1d4ed8 (about 6:1), the verdicts' colours on their tints above
//! 4.5:1 (WCAG 2.2, success criterion 1.4.3).
//!
//! References: W3C, "Web Content Accessibility Guidelines (WCAG) 2.2", success criteria 1.4.3
//! (contrast), 1.4.10 (reflow: no scrolling in two dimensions at 320 CSS px), 2.4.1 (bypass
//! blocks: the skip link) and 2.4.7 (focus visible).

/// The pages' style sheet, the exact text of their `<style>` element.
pub const STYLE: &str = concat!(
    // The frame: one column, paper and ink.
    "*{box-sizing:border-box}",
    "html{-webkit-text-size-adjust:100%;text-size-adjust:100%}",
    "body{margin:0;background:#fbf8f1;color:#1c2833;font:1rem/1.5 system-ui,-apple-system,'Segoe UI',Roboto,'DejaVu Sans',sans-serif}",
    ".frame{max-width:64rem;margin:0 auto;padding:0 1rem}",
    "a{color:#1d4ed8}a:visited{color:#5b21b6}",
    ":focus-visible{outline:3px solid #b45309;outline-offset:2px}",
    ".skip{position:absolute;left:0.5rem;top:-10rem;background:#1c2833;color:#fff;padding:0.5rem 1rem;z-index:2}",
    ".skip:focus{top:0.5rem}",
    // The header: the site's line, the title, the caution.
    ".masthead{background:#fff;border-bottom:4px solid #e0a526}",
    ".site{margin:0;padding-top:0.75rem;font-size:0.85rem;letter-spacing:0.06em;text-transform:uppercase;color:#4a5563}",
    ".site a{color:inherit;text-decoration:none}",
    // The language switch: each language named in itself, the current one underlined.
    ".languages ul{list-style:none;margin:0.25rem 0 0;padding:0;display:flex;flex-wrap:wrap;gap:0.25rem 0.9rem;font-size:0.9rem}",
    ".languages a{color:#1d4ed8;display:inline-block;padding:0.2rem 0}",
    ".languages a[aria-current]{color:#111827;font-weight:bold;text-decoration-thickness:2px}",
    "h1{margin:0.25rem 0 0.75rem;font:normal 1.6rem/1.2 Georgia,'DejaVu Serif',serif;color:#14202b}",
    "h2{margin:2rem 0 0.5rem;font:normal 1.3rem/1.25 Georgia,'DejaVu Serif',serif;color:#14202b}",
    "h3{margin:1.25rem 0 0.4rem;font-size:1.05rem}",
    ".caution{margin:0 0 1rem;border:2px solid #b91c1c;border-left-width:8px;background:#fef2f2;color:#7f1d1d;padding:0.5rem 0.75rem;font-weight:bold;font-size:0.9rem;line-height:1.4}",
    "main{padding-top:0.5rem;padding-bottom:2rem}",
    "p,li,dd,legend,label,figcaption,.headline td{overflow-wrap:anywhere}",
    "code{font-size:0.9em;overflow-wrap:anywhere}",
    "footer{border-top:1px solid #d8cfbd;color:#4a5563;font-size:0.85rem;padding-bottom:1.5rem}",
    // Tables: a wide one scrolls inside its own box, never the page.
    ".scroll{position:relative;overflow-x:auto;max-width:100%;margin:1rem 0}",
    ".scroll:focus-visible{outline-offset:0}",
    "table{border-collapse:collapse;margin:0;font-size:0.9rem;background:#fff}",
    "caption{text-align:left;font-weight:600;padding:0.3rem 0}",
    "th,td{border:1px solid #d8cfbd;padding:0.3rem 0.5rem;text-align:left;vertical-align:top}",
    "th{background:#f3eee2}",
    ".headline th{background:#fff;font-weight:600}",
    "svg{max-width:100%;height:auto}",
    // A chart keeps its own size (text at least 12 px) and scrolls inside its figure.
    "figure.chart{overflow-x:auto}figure.chart>svg{max-width:none}",
    "figure{margin:1.5rem 0}",
    // Cards: a block per timing, per result; the verdicts as words and colours together.
    ".card{background:#fff;border:1px solid #d8cfbd;border-radius:8px;padding:0.75rem 1rem;margin:1rem 0}",
    ".cards{list-style:none;padding:0}",
    ".card dt{font-weight:bold;margin-top:0.3em}",
    ".card dd{margin:0 0 0 1em;overflow-wrap:anywhere}",
    ".station-advice{border-left:4px solid #92400e;padding:0.2em 0.8em}",
    "figure.path{margin:1em 0;max-width:360px}",
    "svg.limb{width:100%;height:auto}",
    ".card>h3:first-child,.card>h2:first-child{margin-top:0}",
    ".timing-block{border-left:6px solid #8a94a3}",
    ".timing-block.fits{border-left-color:#15803d}",
    ".timing-block.doubtful{border-left-color:#b45309}",
    ".timing-block.rejected{border-left-color:#b91c1c}",
    ".facts{display:grid;grid-template-columns:minmax(7rem,auto) 1fr;gap:0.2rem 0.8rem;margin:0.5rem 0}",
    ".facts dt{font-weight:600}.facts dd{margin:0}",
    ".verdict{display:inline-block;padding:0.05rem 0.5rem;border-radius:1rem;font-weight:600}",
    ".fits{color:#166534}.doubtful{color:#92400e}.rejected{color:#b91c1c}",
    ".verdict.fits{background:#dcfce7}.verdict.doubtful{background:#fef3c7}.verdict.rejected{background:#fee2e2}",
    ".note{color:#4a5563;font-size:0.9rem}",
    // Forms: each field stacked, full width, its label above it.
    "form{margin:0}",
    "fieldset{border:1px solid #d8cfbd;border-radius:8px;background:#fff;margin:1rem 0;padding:0.5rem 1rem 1rem;min-width:0}",
    "legend{font-weight:600;padding:0 0.3rem}",
    ".field{margin:0.6rem 0}",
    ".timing{padding:0.25rem 0.75rem 0.75rem}",
    "details.local{margin:0.5rem 0 0;border-top:1px dashed #d8cfbd;padding-top:0.4rem}",
    "summary{cursor:pointer;color:#1d4ed8;padding:0.2rem 0}",
    ".field label{display:block;font-weight:600}",
    ".hint{display:block;font-weight:normal;font-size:0.85rem;color:#4a5563}",
    "input,select,textarea{font:inherit;color:inherit;width:100%;max-width:100%;padding:0.45rem 0.55rem;border:1px solid #6b7280;border-radius:4px;background:#fff}",
    "input[type=file]{padding:0.3rem;border-style:dashed}",
    "textarea{min-height:7rem}",
    "button{font:inherit;font-weight:600;padding:0.55rem 1.4rem;border-radius:6px;border:1px solid #14202b;background:#14202b;color:#fff;cursor:pointer}",
    "button:hover{background:#2b3d50}",
    ".actions{margin:1rem 0}",
    ".inline{display:flex;flex-wrap:wrap;gap:0.4rem;align-items:center}",
    ".inline input{flex:1 1 8rem;width:auto}",
    ".inline button{padding:0.35rem 0.8rem}",
    ".pages{margin:0.5rem 0}",
    ".vh{position:absolute;width:1px;height:1px;overflow:hidden;clip:rect(0 0 0 0);clip-path:inset(50%);white-space:nowrap}",
    // From 600 px: fields side by side, the timings two by two.
    "@media (min-width:600px){",
    ".frame{padding:0 1.5rem}",
    "h1{font-size:2rem}",
    ".caution{font-size:1rem;padding:0.6rem 0.9rem}",
    ".row{display:flex;flex-wrap:wrap;gap:0 1rem}",
    ".row>.field{flex:1 1 11rem}",
    ".row>.field.wide{flex-basis:100%}",
    ".timings{display:grid;grid-template-columns:repeat(2,minmax(0,1fr));gap:0 1rem}",
    "}",
    "@media print{.skip,form,button{display:none}body{background:#fff}.masthead{border-bottom-color:#000}.scroll{overflow:visible}}"
);
