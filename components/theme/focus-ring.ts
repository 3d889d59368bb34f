/** Native platforms draw their own focus indication; only the web needs a stylesheet. */
export function installFocusRing(): void {}
