import { simpleParser } from 'mailparser';

/**
 * The text of a mail's HTML body, for a message that has no text/plain part.
 *
 * mailparser renders HTML as text only when the HTML is the whole message or sits beside a
 * text/plain part; an HTML part inside a multipart container without any text/plain part (a
 * multipart/alternative holding only HTML, or the usual multipart/mixed of an HTML body and an
 * attachment, RFC 2046) comes back as `html` alone. This hands that HTML to mailparser again as a
 * single-part text/html message (base64, so no line or charset rules get in the way), so it is
 * rendered by the same converter and under the same size and nesting limits as any other HTML
 * body: `<blockquote>` becomes `> ` lines, which stripMailQuotes then removes.
 *
 * Returns the text, or `error` when mailparser could not render the HTML.
 */
export async function htmlBodyText(html: string): Promise<{ text: string; error?: string }> {
  const wrapped = `Content-Type: text/html; charset=utf-8\r\nContent-Transfer-Encoding: base64\r\n\r\n${Buffer.from(html, 'utf8').toString('base64')}\r\n`;
  const parsed = await simpleParser(wrapped, { skipImageLinks: true, skipTextLinks: true, skipTextToHtml: true, keepCidLinks: true });
  const failure = (parsed as { textConversionError?: Error }).textConversionError;
  return failure ? { text: parsed.text ?? '', error: failure.message } : { text: parsed.text ?? '' };
}
