package com.stagewise.ui.readings;

import static org.assertj.core.api.Assertions.assertThat;

import com.stagewise.circuit.Stage;
import com.stagewise.diagnosis.Suspect;
import com.stagewise.interchange.StageSheet;
import com.stagewise.ui.words.Words;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;

class ChainLineTest {
  private static Suspect suspect(String fault, double p) {
    return new Suspect(fault, p, true, List.of(fault), "", OptionalDouble.empty(), Map.of());
  }

  @Test
  void chainStage_showsEachSuspectAtItsSection() {
    Stage chain = StageSheet.read(Path.of("data/stages/tarnwell-ps4-channel-chain.stage.json"));
    String line =
        ReadingsText.chainLine(
            chain,
            List.of(
                suspect("U1C:stuck-high", 0.41),
                suspect("R6:open", 0.32),
                suspect("VCC:missing", 0.1)));

    // The sheet's signal order: U1A -> U1B -> U1C -> U1D -> U2A; R6 is U1C's feedback resistor.
    assertThat(line)
        .startsWith("Along the chain: U1A › U1B › U1C ◀ ")
        .contains(Words.fault("U1C:stuck-high"))
        .contains(Words.fault("R6:open"))
        .contains(" › U1D › U2A")
        .endsWith("Not in one section: " + Words.fault("VCC:missing"));
  }

  @Test
  void singleSection_hasNoChainLine() {
    Stage one = StageSheet.read(Path.of("data/stages/larkspur-sm8-line-driver.stage.json"));
    assertThat(ReadingsText.chainLine(one, List.of(suspect("R15:open", 0.9)))).isEmpty();
  }
}
