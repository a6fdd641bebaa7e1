package com.stagewise.history;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.Outcome;
import com.stagewise.history.record.RepairCase;
import com.stagewise.history.record.Unit;
import java.util.List;
import org.junit.jupiter.api.Test;

/** The contract of {@link Units}: what every store does with units and board models. */
public abstract class UnitsContract extends StoreContract {

  @Test
  void boardModel_sameNameOtherCase_returnsTheExistingOne() {
    BoardModel first = store.units().boardModel("MX-8 mixer main board", "Northfield Audio");
    BoardModel again = store.units().boardModel("mx-8 MIXER main board", "");
    assertThat(again).isEqualTo(first);
    assertThat(store.units().boardModels()).hasSize(1);
    assertThat(store.units().findBoardModel(first.id())).contains(first);
    assertThat(store.units().findBoardModel("MX-8 MIXER MAIN BOARD")).contains(first);
  }

  @Test
  void addUnit_duplicateSerialInModel_isRefused() {
    BoardModel model = store.units().boardModel("PSU-30", "");
    store.units().add("A100", model.id(), "");
    assertThatThrownBy(() -> store.units().add("A100", model.id(), ""))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("A100");
  }

  @Test
  void addWithModel_newModel_addsBoth() {
    Units.AddedUnit added = store.units().addWithModel("Z-1", "New board", "job 1");
    assertThat(added.boardModelAdded()).isTrue();
    assertThat(added.boardModel().name()).isEqualTo("New board");
    assertThat(store.units().find(added.unit().id())).contains(added.unit());
    Units.AddedUnit second = store.units().addWithModel("Z-2", "new BOARD", "");
    assertThat(second.boardModelAdded()).isFalse();
    assertThat(second.boardModel()).isEqualTo(added.boardModel());
  }

  @Test
  void addWithModel_blankSerial_addsNoBoardModel() {
    assertThatThrownBy(() -> store.units().addWithModel("   ", "Board X", ""))
        .isInstanceOf(InvalidInputException.class)
        .hasMessageContaining("serial");
    assertThat(store.units().boardModels()).isEmpty();
    assertThat(store.isEmpty()).isTrue();
  }

  @Test
  void addWithModel_serialTakenOnANewModelName_addsNoBoardModel() {
    // The serial clash can only be seen once the model exists: the write must take it back.
    store.units().addWithModel("S-1", "Board A", "");
    assertThatThrownBy(() -> store.units().addWithModel("S-1", "Board A", ""))
        .isInstanceOf(InvalidInputException.class);
    assertThat(store.units().boardModels()).hasSize(1);
    assertThat(store.units().list(null)).hasSize(1);
  }

  @Test
  void search_serialPartIgnoringCaseAndSeparators_findsTheUnits() {
    BoardModel mixer = store.units().boardModel("MX-8", "");
    BoardModel psu = store.units().boardModel("PSU-30", "");
    Unit a = store.units().add("NF8-21037", mixer.id(), "");
    Unit b = store.units().add("nf8 22019", mixer.id(), "");
    Unit c = store.units().add("HI-3005/0412", psu.id(), "");
    assertThat(matches(UnitQuery.serialLike("nf821"))).containsExactly(a);
    assertThat(matches(UnitQuery.serialLike("NF-8"))).containsExactlyInAnyOrder(a, b);
    assertThat(matches(UnitQuery.serialLike("3005 04"))).containsExactly(c);
    assertThat(matches(UnitQuery.serialLike(""))).hasSize(3);
    assertThat(matches(UnitQuery.serialLike("").withBoardModel(psu.id()))).containsExactly(c);
    assertThat(matches(UnitQuery.serialLike("").withLimit(2))).hasSize(2);
    assertThat(matches(UnitQuery.serialLike("%"))).isEmpty();
    assertThat(store.units().search(UnitQuery.serialLike("21037")).get(0).boardModel())
        .isEqualTo("MX-8");
  }

  @Test
  void search_order_exactSerialFirstThenOpenCasesThenSerial() {
    BoardModel model = store.units().boardModel("MX-8", "");
    Unit longer = store.units().add("AB-100", model.id(), "");
    Unit open = store.units().add("AB-105", model.id(), "");
    Unit exact = store.units().add("AB-10", model.id(), "");
    RepairCase c = store.cases().open(open.id(), "hum");
    RepairCase closed = store.cases().open(longer.id(), "dead");
    store.cases().close(closed.id(), Outcome.FIXED, List.of());
    List<UnitMatch> found = store.units().search(UnitQuery.serialLike("ab10"));
    assertThat(found).extracting(UnitMatch::unit).containsExactly(exact, open, longer);
    assertThat(found).extracting(UnitMatch::openCases).containsExactly(0, 1, 0);
    assertThat(c.unitId()).isEqualTo(open.id());
  }

  private List<Unit> matches(UnitQuery query) {
    return store.units().search(query).stream().map(UnitMatch::unit).toList();
  }
}
