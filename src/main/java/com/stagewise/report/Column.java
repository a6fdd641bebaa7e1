package com.stagewise.report;

/**
 * One column of a report table.
 *
 * @param title its heading
 * @param width its width in points, the gap to the next column included
 */
record Column(String title, double width) {}
