/**
 * Part values as people write and print them: SI prefixes and the RKM code ({@link SiValue}),
 * tolerances ({@link Tolerance}), resistor colour bands ({@link ColourCode}), SMD resistor markings
 * ({@link SmdCode}) and the preferred-number series ({@link ESeries}).
 *
 * <p>All numbers are SI units (ohms, farads, volts, hertz) as {@code double}. Parsing and printing
 * never depend on the machine's locale. Text from a user that cannot be read throws {@link
 * com.stagewise.circuit.InvalidInputException} with a message that quotes the text and says what
 * was expected; a non-finite {@code double} handed in by the program throws {@link
 * IllegalArgumentException}.
 */
package com.stagewise.circuit.value;
