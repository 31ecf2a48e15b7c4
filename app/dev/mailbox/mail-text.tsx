// A plain-text mail body with its http(s) links made clickable (the text itself is never treated as HTML).
// Links in the text part are all a developer needs to follow a sign-in or invitation.
const LINK = /(https?:\/\/[^\s<>"')\]]+)/g;

export function MailText({ text }: { text: string }) {
  const parts = text.split(LINK);
  return (
    <pre className="mt-3 overflow-x-auto rounded-lg bg-slate-50 p-3 font-sans text-sm leading-relaxed break-words whitespace-pre-wrap text-slate-800">
      {parts.map((part, index) =>
        index % 2 === 1 ? (
          <a key={index} href={part} className="font-medium break-all text-flux-700 underline underline-offset-2">
            {part}
          </a>
        ) : (
          part
        ),
      )}
    </pre>
  );
}
