package com.stagewise.history.jdbc;

import static com.stagewise.history.jdbc.Require.SOURCE;

import com.stagewise.circuit.InvalidInputException;
import com.stagewise.history.Checks;
import com.stagewise.history.HistoryStore;
import com.stagewise.history.UnitMatch;
import com.stagewise.history.UnitQuery;
import com.stagewise.history.Units;
import com.stagewise.history.record.BoardModel;
import com.stagewise.history.record.Unit;
import java.sql.SQLException;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/** Units and board models in a store reached through JDBC. */
public final class JdbcUnits implements Units {
  private final JdbcAccess history;

  /** Serves the units and board models of the store behind {@code history}. */
  public JdbcUnits(JdbcAccess history) {
    this.history = history;
  }

  @Override
  public BoardModel boardModel(String name, String maker) {
    Checks.shortText(SOURCE, "board model", name, true);
    Checks.shortText(SOURCE, "maker", maker, false);
    Instant now = history.clock().instant();
    return history.write(
        "add a board model",
        c -> {
          try (Rows rows = history.rows(c)) {
            return findOrAddModel(rows, name, maker, now).model();
          }
        });
  }

  /** A board model found or just added. */
  public record ModelFound(BoardModel model, boolean added) {}

  public static ModelFound findOrAddModel(Rows rows, String name, String maker, Instant now)
      throws SQLException {
    Optional<BoardModel> existing =
        rows.first(
            Records.BOARD_MODEL + " WHERE " + rows.dialect().caselessEquals("name"),
            Records::boardModel,
            name.strip());
    if (existing.isPresent()) {
      return new ModelFound(existing.get(), false);
    }
    BoardModel model = new BoardModel(HistoryStore.newId(), name.strip(), maker.strip(), "", now);
    rows.insert(model);
    return new ModelFound(model, true);
  }

  @Override
  public Optional<BoardModel> findBoardModel(String nameOrId) {
    return history.read(
        "find a board model",
        c -> {
          try (Rows rows = history.rows(c)) {
            return findModel(rows, nameOrId);
          }
        });
  }

  private static Optional<BoardModel> findModel(Rows rows, String nameOrId) throws SQLException {
    return rows.first(
        Records.BOARD_MODEL + " WHERE id = ? OR " + rows.dialect().caselessEquals("name"),
        Records::boardModel,
        nameOrId,
        nameOrId.strip());
  }

  @Override
  public List<BoardModel> boardModels() {
    return history.read(
        "list board models",
        c -> {
          try (Rows rows = history.rows(c)) {
            return rows.query(
                Records.BOARD_MODEL + " ORDER BY " + rows.dialect().caselessOrder("name"),
                Records::boardModel);
          }
        });
  }

  @Override
  public Unit add(String serial, String boardModelId, String owner) {
    checkUnit(serial, owner);
    Instant now = history.clock().instant();
    return history.write(
        "add a unit",
        c -> {
          try (Rows rows = history.rows(c)) {
            Require.exists(rows, "board_model", boardModelId, "board model");
            return insertUnit(rows, serial, boardModelId, owner, now);
          }
        });
  }

  @Override
  public AddedUnit addWithModel(String serial, String boardModel, String owner) {
    checkUnit(serial, owner);
    Checks.shortText(SOURCE, "board model", boardModel, true);
    Instant now = history.clock().instant();
    return history.write(
        "add a unit",
        c -> {
          try (Rows rows = history.rows(c)) {
            Optional<BoardModel> known = findModel(rows, boardModel);
            ModelFound found =
                known.isPresent()
                    ? new ModelFound(known.get(), false)
                    : findOrAddModel(rows, boardModel, "", now);
            // A refused unit throws here and the transaction takes the new model back with it.
            Unit unit = insertUnit(rows, serial, found.model().id(), owner, now);
            return new AddedUnit(unit, found.model(), found.added());
          }
        });
  }

  private static void checkUnit(String serial, String owner) {
    Checks.shortText(SOURCE, "serial", serial, true);
    Checks.shortText(SOURCE, "owner", owner, false);
  }

  private static Unit insertUnit(
      Rows rows, String serial, String boardModelId, String owner, Instant now)
      throws SQLException {
    if (rows.first(
            Records.UNIT + " WHERE board_model_id = ? AND serial = ?",
            Records::unit,
            boardModelId,
            serial)
        .isPresent()) {
      throw new InvalidInputException(
          SOURCE, "serial", "this board model already has a unit " + Checks.quote(serial));
    }
    Unit unit = new Unit(HistoryStore.newId(), serial, boardModelId, owner, now);
    rows.insert(unit);
    return unit;
  }

  @Override
  public Optional<Unit> find(String unitId) {
    return history.read(
        "find a unit",
        c -> {
          try (Rows rows = history.rows(c)) {
            return rows.first(Records.UNIT + " WHERE id = ?", Records::unit, unitId);
          }
        });
  }

  @Override
  public List<Unit> bySerial(String serial) {
    return history.read(
        "find units",
        c -> {
          try (Rows rows = history.rows(c)) {
            return rows.query(
                Records.UNIT
                    + " WHERE "
                    + rows.dialect().caselessEquals("serial")
                    + " ORDER BY "
                    + rows.dialect().binaryOrder("serial"),
                Records::unit,
                serial);
          }
        });
  }

  @Override
  public List<Unit> list(String boardModelIdOrNull) {
    return history.read(
        "list units",
        c -> {
          try (Rows rows = history.rows(c)) {
            SqlDialect d = rows.dialect();
            String order = " ORDER BY " + d.binaryOrder("serial") + ", " + d.binaryOrder("id");
            return boardModelIdOrNull == null
                ? rows.query(Records.UNIT + order, Records::unit)
                : rows.query(
                    Records.UNIT + " WHERE board_model_id = ?" + order,
                    Records::unit,
                    boardModelIdOrNull);
          }
        });
  }

  @Override
  public List<UnitMatch> search(UnitQuery query) {
    SqlDialect d = history.dialect();
    String normalSerial = d.normalSerial("u.serial");
    List<Object> parameters = new ArrayList<>();
    StringBuilder sql =
        new StringBuilder(
            "SELECT u.id, u.serial, u.board_model_id, u.owner, u.updated_at, m.name,"
                + " (SELECT count(*) FROM repair_case rc WHERE rc.unit_id = u.id"
                + " AND rc.status = 'open') AS open_cases,"
                + " "
                + normalSerial
                + " = ? AS exact,"
                + " EXISTS (SELECT 1 FROM repair_case rc WHERE rc.unit_id = u.id"
                + " AND rc.status = 'open') AS any_open"
                + " FROM unit u JOIN board_model m ON m.id = u.board_model_id WHERE 1 = 1");
    parameters.add(query.serialPart());
    if (!query.serialPart().isEmpty()) {
      sql.append(" AND ").append(d.contains(normalSerial));
      parameters.add(query.serialPart());
    }
    if (query.boardModelId().isPresent()) {
      sql.append(" AND u.board_model_id = ?");
      parameters.add(query.boardModelId().get());
    }
    sql.append(" ORDER BY exact DESC, any_open DESC, ")
        .append(d.caselessOrder("u.serial"))
        .append(", ")
        .append(d.binaryOrder("u.id"))
        .append(" LIMIT ?");
    parameters.add(query.limit());
    return history.read(
        "search units",
        c -> {
          try (Rows rows = history.rows(c)) {
            return rows.query(
                sql.toString(),
                rs -> new UnitMatch(Records.unit(rs), rs.getString(6), rs.getInt(7)),
                parameters.toArray());
          }
        });
  }
}
