import ReactMarkdown, { defaultUrlTransform } from "react-markdown";
import rehypeSanitize from "rehype-sanitize";

/** Only these schemes become links; javascript:, data: and the rest are dropped. */
const safeSchemes = /^(https?:|mailto:|\/(?!\/)|#)/i;

export function safeUrl(url: string): string {
  const cleaned = defaultUrlTransform(url);
  return safeSchemes.test(cleaned) ? cleaned : "";
}

/**
 * A step's instruction, written in markdown by an instructor. Raw HTML is skipped, the tree is
 * sanitised (rehype-sanitize's GitHub schema) and links keep to http(s), mail and in-app paths, so a
 * card can never carry script to the students who open it.
 */
export function StepMarkdown({ text }: { text: string }) {
  return (
    <div className="step-text">
      <ReactMarkdown
        skipHtml
        rehypePlugins={[rehypeSanitize]}
        urlTransform={safeUrl}
        components={{
          a: ({ href, children }) =>
            href ? (
              <a
                href={href}
                rel="noopener noreferrer nofollow"
                target={href.startsWith("/") || href.startsWith("#") ? undefined : "_blank"}
              >
                {children}
              </a>
            ) : (
              <span>{children}</span>
            ),
          img: ({ alt }) => <span>[picture: {alt || "no description"}]</span>,
        }}
      >
        {text}
      </ReactMarkdown>
    </div>
  );
}
