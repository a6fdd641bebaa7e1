/**
 * The JSON documents of the design notes, read strictly and written for people: stage sheets
 * ({@link com.stagewise.interchange.StageSheet}), readings files ({@link
 * com.stagewise.interchange.ReadingsSheet}) and the solution document ({@link
 * com.stagewise.interchange.SolutionJson}).
 *
 * <p>The only package (with its sub-packages) that uses Jackson. Every complaint about a file is a
 * {@link com.stagewise.circuit.InvalidInputException} naming the file, the JSON path (e.g. {@code
 * parts[2].value}) and what was expected; Jackson's own texts never reach the user.
 */
package com.stagewise.interchange;
