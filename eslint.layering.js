// Layering rule for Meridian Ledger, deny by default (after VS Code's code-layering rule).
//   core/      may import only core/ and the packages listed in CORE_PACKAGES; no platform API.
//   renderer/  may import renderer/ and core/; never main/, Node built-ins or Electron.
//   main/      may import main/ and core/; never renderer/ or browser-only packages.
//   main/preload.ts may import only `electron` and *types* from core/.
// Every import form is checked: static imports, re-exports, dynamic import() and require().
import { builtinModules } from 'node:module';
import path from 'node:path';

const CORE_PACKAGES = new Set(['astronomy-engine']);
const RENDERER_FORBIDDEN_PACKAGES = new Set(['electron', 'tsx']);
const MAIN_FORBIDDEN_PACKAGES = new Set(['svelte', 'dexie', 'd3']);
const PRELOAD_PACKAGES = new Set(['electron']);
const BUILTINS = new Set(builtinModules.flatMap((name) => [name, `node:${name}`]));

function packageName(specifier) {
  const parts = specifier.split('/');
  return specifier.startsWith('@') ? parts.slice(0, 2).join('/') : parts[0];
}

function layerOf(relativePath) {
  const normal = relativePath.split(path.sep).join('/');
  if (normal === 'main/preload.ts') return 'preload';
  const top = normal.split('/')[0];
  return ['core', 'renderer', 'main'].includes(top) ? top : null;
}

const ALLOWED_LAYERS = { core: ['core'], renderer: ['renderer', 'core'], main: ['main', 'core'], preload: ['core'] };

function verdict(layer, specifier, fileAbsolute, root, typeOnly) {
  if (specifier.startsWith('.') || specifier.startsWith('/')) {
    const target = path.relative(root, path.resolve(path.dirname(fileAbsolute), specifier));
    const targetTop = target.split(path.sep)[0];
    if (target.startsWith('..') || !ALLOWED_LAYERS[layer].includes(targetTop)) {
      return `${layer}/ may not import "${specifier}" (it resolves to ${target.split(path.sep).join('/')}, outside ${ALLOWED_LAYERS[layer].map((l) => `${l}/`).join(' and ')})`;
    }
    if (layer === 'preload' && !typeOnly) {
      return `main/preload.ts may import only types from core/ ("${specifier}"): use \`import type\``;
    }
    return null;
  }
  const name = packageName(specifier);
  const builtin = BUILTINS.has(specifier) || BUILTINS.has(name);
  if (layer === 'core' && (builtin || !CORE_PACKAGES.has(name))) {
    return `core/ must stay pure TypeScript and may not import "${specifier}" (allowed packages: ${[...CORE_PACKAGES].join(', ')})`;
  }
  if (layer === 'renderer' && (builtin || RENDERER_FORBIDDEN_PACKAGES.has(name))) {
    return `renderer/ may not import "${specifier}": reach the shell through the bridge in core/bridge.ts`;
  }
  if (layer === 'main' && MAIN_FORBIDDEN_PACKAGES.has(name)) {
    return `main/ may not import the renderer-side package "${specifier}"`;
  }
  if (layer === 'preload' && !PRELOAD_PACKAGES.has(name)) {
    return `main/preload.ts may import only electron and types from core/, not "${specifier}"`;
  }
  return null;
}

function isTypeOnly(node) {
  if (node.importKind === 'type' || node.exportKind === 'type') return true;
  const specifiers = node.specifiers ?? [];
  return specifiers.length > 0 && specifiers.every((s) => s.importKind === 'type' || s.exportKind === 'type');
}

export const layeringRule = {
  meta: {
    type: 'problem',
    docs: { description: 'Keeps core/, renderer/ and main/ inside their layers' },
    schema: [],
    messages: { badLayering: 'Bad layering: {{reason}}' },
  },
  create(context) {
    const root = context.cwd;
    const file = context.filename;
    const layer = layerOf(path.relative(root, file));
    if (layer === null) return {};
    const check = (node, sourceNode, typeOnly) => {
      if (!sourceNode || sourceNode.type !== 'Literal' || typeof sourceNode.value !== 'string') {
        if (sourceNode && layer !== 'main') {
          context.report({ node, messageId: 'badLayering', data: { reason: 'import specifiers must be string literals so layering can be checked' } });
        }
        return;
      }
      const reason = verdict(layer, sourceNode.value, file, root, typeOnly);
      if (reason) context.report({ node, messageId: 'badLayering', data: { reason } });
    };
    return {
      ImportDeclaration: (node) => check(node, node.source, isTypeOnly(node)),
      ExportNamedDeclaration: (node) => node.source && check(node, node.source, isTypeOnly(node)),
      ExportAllDeclaration: (node) => check(node, node.source, node.exportKind === 'type'),
      ImportExpression: (node) => check(node, node.source, false),
      TSImportType: (node) => {
        const literal = node.argument?.literal ?? node.argument;
        check(node, literal, true);
      },
      CallExpression: (node) => {
        if (node.callee.type === 'Identifier' && node.callee.name === 'require') check(node, node.arguments[0], false);
      },
    };
  },
};
