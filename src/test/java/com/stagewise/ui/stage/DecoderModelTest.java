package com.stagewise.ui.stage;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

class DecoderModelTest {

  @Test
  void bands_fourBandCode_decodes() {
    // IEC 60062 colour code: yellow violet red gold = 47 × 100 Ω = 4.7 kΩ ±5 %.
    DecoderModel decoder = new DecoderModel();
    for (String band : new String[] {"yellow", "violet", "red", "gold"}) {
      decoder.addBand(band);
    }
    assertThat(decoder.ohmsProperty().get()).isEqualTo(4700.0);
    assertThat(decoder.resultProperty().get()).endsWith("= 4.7 kΩ ±5%");
  }

  @Test
  void bands_tooFew_sayHowManyAreNeeded() {
    DecoderModel decoder = new DecoderModel();
    decoder.addBand("brown");
    decoder.addBand("black");
    assertThat(decoder.ohmsProperty().get()).isNull();
    assertThat(decoder.resultProperty().get()).contains("at least 3 bands");
    decoder.removeBand();
    decoder.removeBand();
    decoder.removeBand();
    assertThat(decoder.bands()).isEmpty();
  }

  @Test
  void smd_threeDigitCode_decodes() {
    // Three-digit SMD marking: 472 = 47 × 10² Ω = 4.7 kΩ (common practice).
    DecoderModel decoder = new DecoderModel();
    decoder.smdProperty().set("472");
    assertThat(decoder.ohmsProperty().get()).isEqualTo(4700.0);
    decoder.smdProperty().set("47");
    assertThat(decoder.ohmsProperty().get()).isNull();
    assertThat(decoder.resultProperty().get()).startsWith("Not an SMD code yet");
  }

  @Test
  void bands_seventh_isNotAdded() {
    DecoderModel decoder = new DecoderModel();
    for (int i = 0; i < 7; i++) {
      decoder.addBand("brown");
    }
    assertThat(decoder.bands()).hasSize(6);
  }
}
