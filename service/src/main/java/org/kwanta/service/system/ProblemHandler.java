package org.kwanta.service.system;

import jakarta.servlet.http.HttpServletRequest;
import java.sql.SQLException;
import java.sql.SQLTransientConnectionException;
import java.util.LinkedHashMap;
import java.util.Map;
import org.kwanta.model.NoConvergenceException;
import org.kwanta.model.OutOfValidityRangeException;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.dao.DataAccessResourceFailureException;
import org.springframework.dao.DataIntegrityViolationException;
import org.springframework.dao.TransientDataAccessResourceException;
import org.springframework.http.HttpHeaders;
import org.springframework.http.HttpStatus;
import org.springframework.http.HttpStatusCode;
import org.springframework.http.MediaType;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.http.converter.HttpMessageNotReadableException;
import org.springframework.transaction.CannotCreateTransactionException;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.RestControllerAdvice;
import org.springframework.web.context.request.WebRequest;
import org.springframework.web.servlet.mvc.method.annotation.ResponseEntityExceptionHandler;
import tools.jackson.core.JacksonException;
import tools.jackson.core.exc.StreamConstraintsException;
import tools.jackson.core.exc.StreamReadException;
import tools.jackson.databind.exc.MismatchedInputException;
import tools.jackson.databind.exc.UnrecognizedPropertyException;

/**
 * Every error as {@code application/problem+json} with a stable {@code type}: Spring MVC's own
 * exceptions (unknown path, wrong method, malformed body...) through the base class, the engine's
 * through the handlers below. 500 only for bugs, with details in the log and never in the body.
 */
@RestControllerAdvice
class ProblemHandler extends ResponseEntityExceptionHandler {

  private static final Logger log = LoggerFactory.getLogger(ProblemHandler.class);

  private final DatabaseOutage outage;

  ProblemHandler(DatabaseOutage outage) {
    this.outage = outage;
  }

  @ExceptionHandler(OutOfValidityRangeException.class)
  ResponseEntity<ProblemDetail> outOfValidity(OutOfValidityRangeException e) {
    ProblemDetail problem =
        ProblemDetail.forStatusAndDetail(HttpStatus.UNPROCESSABLE_CONTENT, e.getMessage());
    problem.setType(ProblemTypes.OUT_OF_VALIDITY_RANGE);
    problem.setTitle("Input outside the validity range of a formulation");
    Map<String, Object> limit = new LinkedHashMap<>();
    limit.put("quantity", e.range().quantity());
    limit.put("value", finiteOrString(e.value()));
    limit.put("min", e.range().min());
    limit.put("max", e.range().max());
    limit.put("unit", e.range().unit());
    limit.put("source", e.range().source().id());
    problem.setProperty("limit", limit);
    return problem(problem);
  }

  @ExceptionHandler(NoConvergenceException.class)
  ResponseEntity<ProblemDetail> noConvergence(NoConvergenceException e) {
    log.error("Solver did not converge", e);
    ProblemDetail problem =
        ProblemDetail.forStatusAndDetail(HttpStatus.UNPROCESSABLE_CONTENT, e.getMessage());
    problem.setType(ProblemTypes.NO_CONVERGENCE);
    problem.setTitle("Calculation did not converge");
    problem.setProperty("iterations", e.iterations());
    problem.setProperty("residual", finiteOrString(e.residual()));
    return problem(problem);
  }

  @ExceptionHandler(ProblemException.class)
  ResponseEntity<ProblemDetail> badRequest(ProblemException e) {
    ProblemDetail problem = ProblemDetail.forStatusAndDetail(e.status(), e.getMessage());
    problem.setType(e.type());
    problem.setTitle(e.title());
    e.properties().forEach(problem::setProperty);
    return problem(problem);
  }

  /** PostgreSQL unreachable: 503 with Retry-After, never a 500. */
  @ExceptionHandler({
    DataAccessResourceFailureException.class,
    TransientDataAccessResourceException.class,
    CannotCreateTransactionException.class,
    SQLTransientConnectionException.class
  })
  ResponseEntity<ProblemDetail> databaseUnavailable(Exception e, HttpServletRequest request) {
    log.warn("Database unavailable: {}", e.getMessage());
    return ResponseEntity.status(HttpStatus.SERVICE_UNAVAILABLE)
        .header(
            HttpHeaders.RETRY_AFTER,
            Long.toString(ProblemResponses.retryAfterSeconds(outage.retryAfter())))
        .contentType(MediaType.APPLICATION_PROBLEM_JSON)
        .body(outage.problem(request));
  }

  /**
   * A row that PostgreSQL refuses: text it cannot store (U+0000) is the request's fault (400); a
   * duplicate key or a missing referenced row conflicts with what is stored (409). The transaction
   * rolled back: nothing of the request was written.
   */
  @ExceptionHandler(DataIntegrityViolationException.class)
  ResponseEntity<ProblemDetail> integrity(DataIntegrityViolationException e) {
    String state = sqlState(e);
    if (state != null && (state.equals("22021") || state.equals("22P05"))) {
      ProblemDetail problem =
          ProblemDetail.forStatusAndDetail(
              HttpStatus.BAD_REQUEST,
              "The request contains text that cannot be stored (a NUL character, U+0000).");
      problem.setType(ProblemTypes.BAD_REQUEST);
      problem.setTitle("Bad request");
      return problem(problem);
    }
    log.info("Refused by a database constraint: {}", e.getMostSpecificCause().getMessage());
    ProblemDetail problem =
        ProblemDetail.forStatusAndDetail(
            HttpStatus.CONFLICT,
            "The request conflicts with stored data (a duplicate id or a reference to something"
                + " that does not exist); nothing was stored.");
    problem.setType(ProblemTypes.CONFLICT);
    problem.setTitle("Conflict");
    return problem(problem);
  }

  @ExceptionHandler(PayloadTooLargeException.class)
  ResponseEntity<ProblemDetail> tooLarge(PayloadTooLargeException e) {
    ProblemDetail problem =
        ProblemDetail.forStatusAndDetail(HttpStatus.CONTENT_TOO_LARGE, e.getMessage());
    problem.setType(ProblemTypes.PAYLOAD_TOO_LARGE);
    problem.setTitle("Content too large");
    problem.setProperty("limitBytes", e.limitBytes());
    return problem(problem);
  }

  @Override
  protected ResponseEntity<Object> handleHttpMessageNotReadable(
      HttpMessageNotReadableException e,
      HttpHeaders headers,
      HttpStatusCode status,
      WebRequest request) {
    PayloadTooLargeException tooLarge = PayloadTooLargeException.in(e);
    if (tooLarge != null) {
      return createResponseEntity(
          tooLarge(tooLarge).getBody(), headers, HttpStatus.CONTENT_TOO_LARGE, request);
    }
    ProblemDetail problem =
        ProblemDetail.forStatusAndDetail(HttpStatus.BAD_REQUEST, unreadableReason(e));
    problem.setType(ProblemTypes.BAD_REQUEST);
    problem.setTitle("Bad request");
    return createResponseEntity(problem, headers, HttpStatus.BAD_REQUEST, request);
  }

  /** Why a body could not be read, without class names or parser internals. */
  static String unreadableReason(HttpMessageNotReadableException e) {
    Throwable cause = e.getMostSpecificCause();
    for (Throwable t = e; t != null; t = t.getCause() == t ? null : t.getCause()) {
      if (t instanceof JacksonException j) {
        cause = j;
        break;
      }
    }
    if (cause instanceof UnrecognizedPropertyException u) {
      return "Unknown field '"
          + u.getPropertyName()
          + "'"
          + at(u)
          + "; unknown fields are refused.";
    }
    if (cause instanceof StreamConstraintsException) {
      return "The JSON exceeds a parser limit (string length, nesting depth or number length).";
    }
    if (cause instanceof StreamReadException r
        && r.getOriginalMessage() != null
        && r.getOriginalMessage().startsWith("Duplicate Object property")) {
      return "Field "
          + r.getOriginalMessage().substring("Duplicate Object property ".length())
          + " appears twice"
          + at(r)
          + "; each field may appear once.";
    }
    if (cause instanceof StreamReadException) {
      return "The body is not well-formed JSON.";
    }
    if (cause instanceof MismatchedInputException m && m.getTargetType() != null) {
      Class<?> type = m.getTargetType();
      if (Number.class.isAssignableFrom(type)
          || (type.isPrimitive() && type != boolean.class && type != char.class)) {
        return "Expected a JSON number" + at(m) + ", not text or another type.";
      }
      if (type == Boolean.class || type == boolean.class) {
        return "Expected true or false" + at(m) + ", not text or a number.";
      }
    }
    if (cause instanceof JacksonException j) {
      return "The body does not match the expected shape" + at(j) + ".";
    }
    return "The request body is missing or unreadable.";
  }

  private static String at(JacksonException e) {
    StringBuilder path = new StringBuilder();
    for (JacksonException.Reference r : e.getPath()) {
      if (r.getPropertyName() != null) {
        path.append(path.isEmpty() ? "" : ".").append(r.getPropertyName());
      } else if (r.getIndex() >= 0) {
        path.append('[').append(r.getIndex()).append(']');
      }
    }
    return path.isEmpty() ? "" : " at '" + path + "'";
  }

  private static String sqlState(Throwable e) {
    for (Throwable t = e; t != null; t = t.getCause() == t ? null : t.getCause()) {
      if (t instanceof SQLException sql && sql.getSQLState() != null) {
        return sql.getSQLState();
      }
    }
    return null;
  }

  @ExceptionHandler(Exception.class)
  ResponseEntity<ProblemDetail> unexpected(Exception e, HttpServletRequest request) {
    if (DatabaseOutage.isCause(e)) {
      return databaseUnavailable(e, request);
    }
    PayloadTooLargeException tooLarge = PayloadTooLargeException.in(e);
    if (tooLarge != null) {
      return tooLarge(tooLarge);
    }
    log.error("Unexpected error", e);
    ProblemDetail problem =
        ProblemDetail.forStatusAndDetail(
            HttpStatus.INTERNAL_SERVER_ERROR, "An internal error occurred; it has been logged.");
    problem.setType(ProblemTypes.INTERNAL);
    problem.setTitle("Internal error");
    return problem(problem);
  }

  @Override
  protected ResponseEntity<Object> createResponseEntity(
      Object body, HttpHeaders headers, HttpStatusCode statusCode, WebRequest request) {
    if (body instanceof ProblemDetail problem
        && (problem.getType() == null || "about:blank".equals(problem.getType().toString()))) {
      problem.setType(ProblemTypes.forStatus(statusCode.value()));
    }
    HttpStatus known = HttpStatus.resolve(statusCode.value());
    if (body instanceof ProblemDetail problem
        && known != null
        && known.getReasonPhrase().equals(problem.getTitle())) {
      problem.setTitle(ProblemResponses.title(statusCode)); // Spring's titles are title case
    }
    HttpHeaders out = new HttpHeaders();
    out.putAll(headers);
    out.setContentType(MediaType.APPLICATION_PROBLEM_JSON);
    return new ResponseEntity<>(body, out, statusCode);
  }

  private static ResponseEntity<ProblemDetail> problem(ProblemDetail problem) {
    return ResponseEntity.status(problem.getStatus())
        .contentType(MediaType.APPLICATION_PROBLEM_JSON)
        .body(problem);
  }

  private static Object finiteOrString(double v) {
    return Double.isFinite(v) ? v : Double.toString(v);
  }
}
