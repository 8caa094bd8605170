//! The hazard report as one self-contained HTML page: inline style, an inline SVG chart of the
//! heats per gram and the adiabatic temperature rises with their error bars, the 500 J/g line and
//! the severity bands, the tables, the sources, the job's errors, and the cautions printed on the
//! page itself. No script, no external resource: the page opens offline.

use super::hazard::{
    compound_cells, error_lines, heading_lines, method_lines, step_rows, COMPOUND_HEADER,
    STEP_HEADER,
};
use crate::hazard::screen::{Screening, StepResult};
use crate::hazard::severity::{SCREENING_LINE_J_PER_G, SEVERITY_BANDS};
use crate::hazard::CAUTIONS;

/// Colours of the severity bands (low, medium, high) and of the bars.
pub const BAND_COLOURS: [&str; 3] = ["#d8f0d2", "#fbe7b5", "#f6c3bd"];
/// Bar colour of the heats.
pub const HEAT_COLOUR: &str = "#3b6ea8";
/// Bar colour of the rises.
pub const RISE_COLOUR: &str = "#7a3b8f";

/// Escapes text for HTML and SVG.
pub fn escape(text: &str) -> String {
    text.replace('&', "&amp;")
        .replace('<', "&lt;")
        .replace('>', "&gt;")
        .replace('"', "&quot;")
}

const ROW_H: f64 = 30.0;
const LABEL_W: f64 = 250.0;
const PANEL_W: f64 = 300.0;
const GAP: f64 = 40.0;
const TOP: f64 = 56.0;

struct Axis {
    min: f64,
    max: f64,
    x0: f64,
}

impl Axis {
    fn x(&self, v: f64) -> f64 {
        self.x0 + (v.clamp(self.min, self.max) - self.min) / (self.max - self.min) * PANEL_W
    }
}

fn nice_step(span: f64) -> f64 {
    let raw = span / 5.0;
    let mag = 10f64.powf(raw.log10().floor());
    [1.0, 2.0, 5.0, 10.0]
        .iter()
        .map(|m| m * mag)
        .find(|s| *s >= raw)
        .unwrap_or(10.0 * mag)
}

fn axis(values: &[(f64, f64)], at_least: f64, x0: f64) -> Axis {
    let hi = values.iter().map(|(v, u)| v + u).fold(at_least, f64::max);
    let lo = values.iter().map(|(v, u)| v - u).fold(0.0, f64::min);
    let step = nice_step(hi - lo);
    Axis {
        min: (lo / step).floor() * step,
        max: (hi * 1.05 / step).ceil() * step,
        x0,
    }
}

fn ticks(a: &Axis, y: f64, height: f64, out: &mut String) {
    let step = nice_step(a.max - a.min);
    let mut v = a.min;
    while v <= a.max + 1e-9 {
        let x = a.x(v);
        out.push_str(&format!(
            "<line x1=\"{x:.1}\" y1=\"{y:.1}\" x2=\"{x:.1}\" y2=\"{:.1}\" stroke=\"#ccc\" stroke-width=\"0.5\"/>\
             <text x=\"{x:.1}\" y=\"{:.1}\" font-size=\"10\" text-anchor=\"middle\">{v:.0}</text>",
            y + height,
            y + height + 13.0
        ));
        v += step;
    }
}

fn bar(a: &Axis, y: f64, value: f64, unc: f64, colour: &str, class: &str, out: &mut String) {
    let (x1, x2) = (a.x(0.0_f64.max(a.min)), a.x(value));
    let (left, w) = if x2 >= x1 {
        (x1, x2 - x1)
    } else {
        (x2, x1 - x2)
    };
    let (e1, e2) = (a.x(value - unc), a.x(value + unc));
    let mid = y + ROW_H / 2.0;
    out.push_str(&format!(
        "<rect class=\"{class}\" x=\"{left:.1}\" y=\"{:.1}\" width=\"{w:.1}\" height=\"{:.1}\" fill=\"{colour}\"/>\
         <line class=\"errorbar\" x1=\"{e1:.1}\" y1=\"{mid:.1}\" x2=\"{e2:.1}\" y2=\"{mid:.1}\" stroke=\"#111\" stroke-width=\"1.5\"/>\
         <line class=\"errorbar\" x1=\"{e1:.1}\" y1=\"{:.1}\" x2=\"{e1:.1}\" y2=\"{:.1}\" stroke=\"#111\" stroke-width=\"1.5\"/>\
         <line class=\"errorbar\" x1=\"{e2:.1}\" y1=\"{:.1}\" x2=\"{e2:.1}\" y2=\"{:.1}\" stroke=\"#111\" stroke-width=\"1.5\"/>",
        y + 7.0,
        ROW_H - 14.0,
        mid - 6.0,
        mid + 6.0,
        mid - 6.0,
        mid + 6.0
    ));
}

/// The SVG chart of the screened steps.
pub fn chart_svg(steps: &[&StepResult]) -> String {
    let n = steps.len().max(1) as f64;
    let plot_h = n * ROW_H;
    let width = LABEL_W + 2.0 * PANEL_W + GAP + 30.0;
    let height = TOP + plot_h + 70.0;
    let heats: Vec<(f64, f64)> = steps
        .iter()
        .map(|s| (s.heat_j_per_g.value, s.heat_j_per_g.uncertainty))
        .collect();
    let rises: Vec<(f64, f64)> = steps
        .iter()
        .map(|s| (s.adiabatic_rise_k.value, s.adiabatic_rise_k.uncertainty))
        .collect();
    let ha = axis(&heats, SCREENING_LINE_J_PER_G * 1.2, LABEL_W);
    let ra = axis(&rises, SEVERITY_BANDS[2].1 * 1.25, LABEL_W + PANEL_W + GAP);
    let mut s = format!(
        "<svg id=\"ringheat-chart\" xmlns=\"http://www.w3.org/2000/svg\" width=\"{width:.0}\" height=\"{height:.0}\" \
         viewBox=\"0 0 {width:.0} {height:.0}\" role=\"img\" aria-label=\"Heat per gram and adiabatic temperature rise of each step\" \
         font-family=\"sans-serif\">"
    );
    s.push_str(&format!(
        "<text x=\"{:.1}\" y=\"20\" font-size=\"13\" font-weight=\"bold\">Heat released, J/g of reacting mass</text>\
         <text x=\"{:.1}\" y=\"20\" font-size=\"13\" font-weight=\"bold\">Adiabatic temperature rise, K</text>",
        ha.x0, ra.x0
    ));
    // Severity bands behind the rise bars.
    for (i, (name, lower)) in SEVERITY_BANDS.iter().enumerate() {
        let upper = SEVERITY_BANDS.get(i + 1).map_or(ra.max, |b| b.1);
        let (x1, x2) = (ra.x(*lower), ra.x(upper));
        if x2 <= x1 {
            continue;
        }
        s.push_str(&format!(
            "<rect class=\"band band-{name}\" x=\"{x1:.1}\" y=\"{TOP:.1}\" width=\"{:.1}\" height=\"{plot_h:.1}\" fill=\"{}\"/>\
             <text x=\"{:.1}\" y=\"{:.1}\" font-size=\"11\" text-anchor=\"middle\">{name}</text>",
            x2 - x1,
            BAND_COLOURS[i],
            (x1 + x2) / 2.0,
            TOP - 8.0
        ));
    }
    ticks(&ha, TOP, plot_h, &mut s);
    ticks(&ra, TOP, plot_h, &mut s);
    for (i, step) in steps.iter().enumerate() {
        let y = TOP + i as f64 * ROW_H;
        let label: String = step.name.chars().take(36).collect();
        s.push_str(&format!(
            "<text x=\"{:.1}\" y=\"{:.1}\" font-size=\"12\" text-anchor=\"end\">{}</text>",
            LABEL_W - 8.0,
            y + ROW_H / 2.0 + 4.0,
            escape(&label)
        ));
        bar(
            &ha,
            y,
            heats[i].0,
            heats[i].1,
            HEAT_COLOUR,
            "bar-heat",
            &mut s,
        );
        bar(
            &ra,
            y,
            rises[i].0,
            rises[i].1,
            RISE_COLOUR,
            "bar-rise",
            &mut s,
        );
    }
    let lx = ha.x(SCREENING_LINE_J_PER_G);
    s.push_str(&format!(
        "<line id=\"screening-line\" x1=\"{lx:.1}\" y1=\"{:.1}\" x2=\"{lx:.1}\" y2=\"{:.1}\" stroke=\"#c0392b\" stroke-width=\"2\" stroke-dasharray=\"6 4\"/>\
         <text x=\"{lx:.1}\" y=\"{:.1}\" font-size=\"11\" fill=\"#c0392b\" text-anchor=\"middle\">500 J/g</text>",
        TOP - 4.0,
        TOP + plot_h,
        TOP - 8.0
    ));
    for a in [&ha, &ra] {
        s.push_str(&format!(
            "<line x1=\"{:.1}\" y1=\"{:.1}\" x2=\"{:.1}\" y2=\"{:.1}\" stroke=\"#333\"/>",
            a.x(0.0_f64.max(a.min)),
            TOP,
            a.x(0.0_f64.max(a.min)),
            TOP + plot_h
        ));
    }
    s.push_str(&format!(
        "<text x=\"{:.1}\" y=\"{:.1}\" font-size=\"11\">Bars: central values; whiskers: the propagated uncertainty. Background: severity bands of the adiabatic rise.</text>",
        LABEL_W,
        TOP + plot_h + 40.0
    ));
    s.push_str("</svg>");
    s
}

fn html_table(header: &[&str], rows: &[Vec<String>]) -> String {
    let mut out = String::from("<table><thead><tr>");
    for h in header {
        out.push_str(&format!("<th>{}</th>", escape(h)));
    }
    out.push_str("</tr></thead><tbody>");
    for r in rows {
        out.push_str("<tr>");
        for c in r {
            out.push_str(&format!("<td>{}</td>", escape(c)));
        }
        out.push_str("</tr>");
    }
    out.push_str("</tbody></table>");
    out
}

fn cautions_section() -> String {
    let mut out = String::from("<section class=\"cautions\"><h2>Cautions</h2><ul>");
    for c in CAUTIONS {
        out.push_str(&format!("<li>{}</li>", escape(c)));
    }
    out.push_str("</ul></section>");
    out
}

/// The whole page.
pub fn render_html(s: &Screening) -> String {
    let heading = heading_lines(s);
    let mut out = String::from(
        "<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\">\
         <meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">",
    );
    out.push_str(&format!("<title>{}</title>", escape(&heading[0])));
    out.push_str(
        "<style>body{font-family:sans-serif;margin:24px;color:#111;max-width:1250px}\
         h1{font-size:22px}h2{font-size:17px;margin-top:28px}\
         table{border-collapse:collapse;font-size:13px;margin:8px 0}\
         th,td{border:1px solid #bbb;padding:3px 7px;text-align:left;vertical-align:top}\
         th{background:#eef1f5}.cautions{border:2px solid #c0392b;background:#fdf0ee;padding:6px 16px;margin:14px 0}\
         .cautions h2{margin-top:6px;color:#a0281c}.invented{font-style:italic;color:#555}\
         .errors{background:#fff6e0;border:1px solid #e0b44c;padding:6px 12px;font-family:monospace;font-size:12px;white-space:pre-wrap}\
         .detail{font-size:13px}.detail li{margin:2px 0}</style></head><body>",
    );
    out.push_str(&format!("<h1>{}</h1>", escape(&heading[0])));
    for l in &heading[1..] {
        let class = if l.starts_with("Invented") {
            " class=\"invented\""
        } else {
            ""
        };
        out.push_str(&format!("<p{class}>{}</p>", escape(l)));
    }
    out.push_str(&cautions_section().replacen(
        "class=\"cautions\"",
        "class=\"cautions\" id=\"cautions-top\"",
        1,
    ));
    let screened: Vec<&StepResult> = s
        .steps
        .iter()
        .filter_map(|st| st.result.as_ref().ok())
        .collect();
    out.push_str("<h2>Heats and adiabatic temperature rises</h2>");
    out.push_str(&chart_svg(&screened));
    out.push_str("<h2>Steps</h2>");
    let rows = step_rows(s);
    out.push_str(&html_table(&STEP_HEADER, &rows));
    out.push_str("<h2>Compounds</h2>");
    let rows: Vec<Vec<String>> = s.compounds.iter().map(compound_cells).collect();
    out.push_str(&html_table(&COMPOUND_HEADER, &rows));
    out.push_str("<h2>Step details and sources</h2>");
    for r in &screened {
        out.push_str(&format!(
            "<div class=\"detail\"><h3>{} (line {})</h3><p>{}<br>States: {}; per mole of {}.</p><ul>",
            escape(&r.name),
            r.line,
            escape(&r.description),
            escape(&r.states),
            escape(&r.key_species)
        ));
        for src in &r.sources {
            out.push_str(&format!("<li>source: {}</li>", escape(src)));
        }
        for f in &r.flags {
            out.push_str(&format!("<li>flag: {}</li>", escape(f)));
        }
        out.push_str("</ul></div>");
    }
    let errors = error_lines(s);
    if !errors.is_empty() {
        out.push_str("<h2>Errors in the job file</h2><p>These entries were not screened; the others are reported above.</p><div class=\"errors\">");
        for e in errors {
            out.push_str(&escape(&e));
            out.push('\n');
        }
        out.push_str("</div>");
    }
    out.push_str("<h2>Methods and sources</h2><ul class=\"detail\">");
    for m in method_lines() {
        out.push_str(&format!("<li>{}</li>", escape(&m)));
    }
    out.push_str("</ul>");
    out.push_str(&cautions_section().replacen(
        "class=\"cautions\"",
        "class=\"cautions\" id=\"cautions\"",
        1,
    ));
    out.push_str("<p class=\"invented\">Report written by ringheat.</p></body></html>\n");
    out
}
