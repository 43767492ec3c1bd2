// Said on `window` by the reader as it settles on another page, so what sits beside it (the page's
// text) can follow. Its own tiny module: importing the reader for a name would pull pdf.js into the page.
export const readerPageEvent = "hangarleaf:reader-page";
