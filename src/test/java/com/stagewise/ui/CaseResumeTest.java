package com.stagewise.ui;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class CaseResumeTest {
  @TempDir Path temp;

  @Test
  void load_afterSave_givesTheStepAndTheEditedStage() {
    CaseResume resume = new CaseResume(temp.resolve("open"));
    var stage = TestBench.invertingStage("Board").withPart("R2", p -> p.withValue(22_000));
    resume.saveStage("0f3a-11", stage);
    resume.saveStep("0f3a-11", Step.SUSPECTS);
    CaseResume.Saved saved = new CaseResume(temp.resolve("open")).load("0f3a-11").orElseThrow();
    assertThat(saved.step()).isEqualTo(Step.SUSPECTS);
    assertThat(saved.stage().orElseThrow().part("R2").orElseThrow().value()).isEqualTo(22_000.0);
  }

  @Test
  void load_unknownCase_isEmpty_andForgetRemovesIt() {
    CaseResume resume = new CaseResume(temp);
    assertThat(resume.load("abc")).isEmpty();
    resume.saveStep("abc", Step.READINGS);
    assertThat(resume.load("abc")).isPresent();
    resume.forget("abc");
    assertThat(resume.load("abc")).isEmpty();
  }

  @Test
  void saveStep_idWithPathCharacters_isRefused() {
    CaseResume resume = new CaseResume(temp);
    assertThatThrownBy(() -> resume.saveStep("../x", Step.STAGE))
        .isInstanceOf(IllegalArgumentException.class);
  }
}
