package com.stagewise.history;

import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.Unit;
import java.util.List;
import java.util.Optional;

/** The units under repair and the board models they are built to. */
public interface Units {

  /**
   * Returns the board model named {@code name} (ignoring letter case), adding it if there is none.
   *
   * @throws com.stagewise.circuit.InvalidInputException if the name is empty or text is too long
   */
  BoardModel boardModel(String name, String maker);

  /** Returns the board model with this name (ignoring letter case) or id, if there is one. */
  Optional<BoardModel> findBoardModel(String nameOrId);

  /** Returns every board model, by name. */
  List<BoardModel> boardModels();

  /**
   * Adds a unit of a board model and returns it.
   *
   * @throws com.stagewise.circuit.InvalidInputException if the serial is empty, the board model is
   *     unknown, or it already has a unit with this serial
   */
  Unit add(String serial, String boardModelId, String owner);

  /**
   * Adds a unit of the board model named (or with the id) {@code boardModel}, adding that model
   * first when there is none, in one transaction: if the unit is refused (an empty serial, a serial
   * the model already has), no board model is added either.
   *
   * @throws com.stagewise.circuit.InvalidInputException as {@link #add} and {@link #boardModel} do
   */
  AddedUnit addWithModel(String serial, String boardModel, String owner);

  /** Returns the unit with this id, if there is one. */
  Optional<Unit> find(String unitId);

  /** Returns the units with this serial (ignoring letter case), of any board model. */
  List<Unit> bySerial(String serial);

  /** Returns the units of a board model (or of every model, for null), by serial. */
  List<Unit> list(String boardModelIdOrNull);

  /**
   * Returns the units that match {@code query}, with their board model's name and how many open
   * cases each has, in one query: exact serials first, then units with a case open, then by serial.
   */
  List<UnitMatch> search(UnitQuery query);

  /**
   * A unit just added, its board model, and whether that model was added with it.
   *
   * @param unit the new unit
   * @param boardModel its board model
   * @param boardModelAdded whether the board model was new
   */
  record AddedUnit(Unit unit, BoardModel boardModel, boolean boardModelAdded) {}
}
