import '@testing-library/jest-dom/vitest';

// happy-dom has no HTMLSelectElement.size nor HTMLOptionElement.defaultSelected. react-hook-form
// reads both to tell a select the user has already changed from one it should set, so without
// them every registered select would start at its first option instead of its default value.
if (!('size' in HTMLSelectElement.prototype)) {
  Object.defineProperty(HTMLSelectElement.prototype, 'size', {
    configurable: true,
    get(this: HTMLSelectElement) {
      return Number(this.getAttribute('size') ?? 0);
    },
  });
}
if (!('defaultSelected' in HTMLOptionElement.prototype)) {
  Object.defineProperty(HTMLOptionElement.prototype, 'defaultSelected', {
    configurable: true,
    get(this: HTMLOptionElement) {
      return this.hasAttribute('selected');
    },
  });
}
