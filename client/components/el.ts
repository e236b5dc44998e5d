/** Something that can go inside an element: text (always inserted as text, never parsed as HTML), a node, or nothing. */
export type Child = Node | string | number | null | undefined | false;

/** Properties set on a new element; `class`, `for` and `data-*` / `aria-*` become attributes. */
export type Props = Record<string, string | number | boolean | null | undefined | EventListener>;

/**
 * Create an element. Strings become text nodes, so user-provided labels,
 * genotypes and file names can never inject markup.
 */
export function el<K extends keyof HTMLElementTagNameMap>(tag: K, props: Props = {}, ...children: Child[]): HTMLElementTagNameMap[K] {
  const node = document.createElement(tag);
  for (const [key, value] of Object.entries(props)) {
    if (value === null || value === undefined || value === false) continue;
    if (key.startsWith("on") && typeof value === "function") node.addEventListener(key.slice(2), value);
    else if (value === true) node.setAttribute(key, "");
    else node.setAttribute(key, String(value));
  }
  append(node, ...children);
  return node;
}

/** Append children, strings as text nodes. */
export function append(parent: Node, ...children: Child[]): void {
  for (const c of children) {
    if (c === null || c === undefined || c === false) continue;
    parent.appendChild(typeof c === "string" || typeof c === "number" ? document.createTextNode(String(c)) : c);
  }
}

/** Replace all of an element's children. */
export function replaceChildren(parent: Element, ...children: Child[]): void {
  parent.replaceChildren();
  append(parent, ...children);
}
