package dev.sequencer.io;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.StreamReadFeature;
import com.fasterxml.jackson.core.json.JsonReadFeature;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.json.JsonMapper;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

/**
 * Text to JSON tree. NaN and Infinity are accepted by the parser so that the readers can report them
 * with a path; duplicate keys and trailing content are parse errors.
 */
final class Json {
  private static final JsonMapper MAPPER =
      JsonMapper.builder()
          .enable(JsonReadFeature.ALLOW_NON_NUMERIC_NUMBERS)
          .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
          .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
          .build();

  private Json() {}

  /**
   * The document's root object, or null after reporting malformed JSON in our words (see
   * {@link JsonSyntax}); {@code source} names the document (a file name) in that message.
   */
  static JsonNode parseObject(String text, String source, Problems p) {
    JsonNode root;
    try {
      root = MAPPER.readTree(text);
    } catch (JsonProcessingException e) {
      Problem syntax = JsonSyntax.describe(e, source);
      p.add(syntax.path(), syntax.message(), null);
      return null;
    }
    if (root == null || root.isMissingNode()) {
      p.add("", "empty input: expected a JSON object", null);
      return null;
    }
    if (!root.isObject()) {
      p.invalid("", "the document must be a JSON object", root);
      return null;
    }
    return root;
  }

  /** The file's text; a file that is not UTF-8 is bad input (a {@link ScenarioException}), not an I/O error. */
  static String read(Path file) {
    try {
      return Files.readString(file, StandardCharsets.UTF_8);
    } catch (CharacterCodingException e) {
      throw new ScenarioException(file.toString(), List.of(new Problem("",
          "not valid UTF-8 text (JSON files must be UTF-8; was it saved in another encoding?)", null)));
    } catch (IOException e) {
      throw new UncheckedIOException("cannot read " + file, e);
    }
  }

  static String read(InputStream in) {
    try {
      return new String(in.readAllBytes(), StandardCharsets.UTF_8);
    } catch (IOException e) {
      throw new UncheckedIOException("cannot read the input stream", e);
    }
  }
}
