// The editor on its own, for scripts/bench-editor.ts: no router, no API. The benchmark injects the
// plan as window.__BENCH_PLAN__ before this loads and drives the page with real mouse input.
import '@fontsource/inter/400.css';
import '@fontsource/inter/600.css';
import '@fontsource/jetbrains-mono/500.css';
import '../../index.css';
import { createRoot } from 'react-dom/client';
import products from '../../../examples/products.json';
import { planSchema } from '../../../shared/plan/plan-schema';
import { parseProductCatalogue } from '../../../shared/takeoff/products';
import { createEditor } from '../create-editor';
import { EditorView } from '../ui/editor-view';

declare global {
  interface Window {
    __BENCH_PLAN__?: unknown;
    __benchEditor?: ReturnType<typeof createEditor>;
  }
}

const plan = planSchema.parse(window.__BENCH_PLAN__);
const editor = createEditor(plan);
window.__benchEditor = editor;
const catalogue = parseProductCatalogue(products);

createRoot(document.getElementById('root')!).render(
  <div style={{ height: '100vh' }}>
    <EditorView editor={editor} products={catalogue} />
  </div>,
);
