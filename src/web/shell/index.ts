export { AppShell, networkNav, type ShellUser } from './AppShell';
export { PageHeader } from './PageHeader';
export { Brand, BrandMark } from './Brand';
export { SkipLink } from './SkipLink';
export { THEME_BOOT_SCRIPT } from './theme-script';
