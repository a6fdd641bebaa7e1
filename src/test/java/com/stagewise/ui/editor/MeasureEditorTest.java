package com.stagewise.ui.editor;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.AcMeasure;
import com.stagewise.circuit.Stage;
import com.stagewise.circuit.TestInput;
import com.stagewise.circuit.template.Templates;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;

/**
 * The editor keeps the measure an input's AC amplitude is stated in (DESIGN.md, stage sheet: {@code
 * "measure"}): editing the input's level, amplitude or net must not turn an RMS amplitude into a
 * peak one, which would change the signal by √2.
 */
class MeasureEditorTest {

  @ParameterizedTest
  @EnumSource(AcMeasure.class)
  void editedInput_keepsItsMeasure(AcMeasure measure) {
    Stage template =
        Templates.all().stream()
            .map(t -> t.build())
            .filter(s -> s.inputs().stream().anyMatch(TestInput::hasAc))
            .findFirst()
            .orElseThrow();
    Stage stated =
        template.withInputs(
            template.inputs().stream()
                .map(i -> new TestInput(i.net(), i.dc(), i.ac(), i.hz(), measure))
                .toList());
    StageEditorModel editor = new StageEditorModel();
    editor.startFrom(stated, "stated");
    assertThat(editor.save().orElseThrow()).isEqualTo(stated);

    assertThat(editor.setInputDc(0, "0.5")).isTrue();
    assertThat(editor.setInputAc(0, "0.2", "2k")).isTrue();
    Stage saved = editor.save().orElseThrow();
    assertThat(saved.inputs().get(0).measure()).isEqualTo(measure);
    assertThat(saved.inputs().get(0).ac()).isEqualTo(0.2);
    assertThat(saved.inputs().get(0).hz()).isEqualTo(2000);
  }
}
