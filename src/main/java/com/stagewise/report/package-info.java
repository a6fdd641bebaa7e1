/**
 * The printed repair report of one case: what goes on the page ({@code ReportLayout}, plain Java,
 * measured through {@code TextWidth}) and the PDF it is drawn into ({@link
 * com.stagewise.report.PdfReport}, Apache PDFBox with the standard Helvetica fonts).
 *
 * <p>The layout never sees a character that the standard fonts cannot draw: {@code Printable} maps
 * every text to the WinAnsi character set first (Ω becomes "ohm", → becomes "->"). Times are
 * printed in UTC and numbers with a decimal point, whatever the machine's locale. Only this package
 * uses PDFBox; {@code cli}, {@code app} and {@code ui} may use it, nothing else does.
 */
package com.stagewise.report;
