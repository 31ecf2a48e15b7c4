// Runs in the browser before the app's own modules: settings that must be in place before any of them is evaluated.
// zod must not probe for code generation (Function) when the first schema is built: the CSP forbids eval.
import '@/lib/validations/zod-without-codegen';
