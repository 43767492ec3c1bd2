// Classic script-injection payloads in a step's markdown must render as inert text: no script
// element, no event-handler attribute, no javascript:/data:/vbscript: link, no iframe or form.
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { StepMarkdown } from "@/components/step-markdown";

const payloads = [
  "<script>alert(1)</script>",
  "<img src=x onerror=alert(1)>",
  "<svg/onload=alert(1)>",
  '<iframe src="javascript:alert(1)"></iframe>',
  '<a href="javascript:alert(1)">click</a>',
  "[click](javascript:alert(1))",
  "[click](JaVaScRiPt:alert(1))",
  "[click](  javascript:alert(1))",
  "[click](java&#x09;script:alert(1))",
  "[click](data:text/html;base64,PHNjcmlwdD5hbGVydCgxKTwvc2NyaXB0Pg==)",
  "[click](vbscript:msgbox(1))",
  "![x](javascript:alert(1))",
  '![x](x" onerror="alert(1))',
  '<div style="background:url(javascript:alert(1))">x</div>',
  '<form action="javascript:alert(1)"><input type=submit></form>',
  "<details open ontoggle=alert(1)>",
  "<body onload=alert(1)>",
  "<math><mtext><table><mglyph><style><img src=x onerror=alert(1)>",
  '<a href="#" onclick="alert(1)">x</a>',
  "[x](<javascript:alert(1)>)",
  '<object data="javascript:alert(1)"></object>',
  '<embed src="javascript:alert(1)">',
  '<meta http-equiv="refresh" content="0;url=javascript:alert(1)">',
];

const render = (text: string) => renderToStaticMarkup(createElement(StepMarkdown, { text }));

describe("step markdown", () => {
  it("renders ordinary markdown", () => {
    const html = render("Torque to **50 in-lb**, then see [the chart](/library) and [the site](https://example.test/a).");
    expect(html).toContain("<strong>50 in-lb</strong>");
    expect(html).toContain('href="/library"');
    expect(html).toContain('href="https://example.test/a"');
    expect(html).toContain('rel="noopener noreferrer nofollow"');
  });

  for (const payload of payloads) {
    it(`renders inert: ${payload}`, () => {
      const html = render(payload).toLowerCase();
      expect(html).not.toMatch(/<script|<iframe|<object|<embed|<form|<svg|<math|<style|<meta|<body|<img/);
      // Attributes inside real tags only: escaped text such as "&quot; onerror=" is harmless.
      const tags = html.match(/<[^>]*>/g) ?? [];
      for (const tag of tags) {
        expect(tag).not.toMatch(/\son[a-z]+\s*=/);
        expect(tag).not.toMatch(/(href|src|action|data)="\s*(javascript|data|vbscript):/);
        expect(tag).not.toMatch(/style=/);
      }
    });
  }
});
