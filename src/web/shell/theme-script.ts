export const THEME_KEY = 'cavitas-theme';

/** Inline script for <head>: applies the stored theme choice before first paint. */
export const THEME_BOOT_SCRIPT = `try{var t=localStorage.getItem('${THEME_KEY}');if(t==='light'||t==='dark')document.documentElement.dataset.theme=t}catch(e){}`;
