/**
 * Stage templates: the common op-amp stages ({@link com.stagewise.circuit.template.Templates}),
 * each built from a few named values into a {@link com.stagewise.circuit.Stage}, and the edits that
 * fit one to a real board ({@link com.stagewise.circuit.template.StageEdits}: designators, net
 * names, title).
 */
package com.stagewise.circuit.template;
