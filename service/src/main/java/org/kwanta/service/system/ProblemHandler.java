package org.kwanta.service.system;

import java.util.LinkedHashMap;
import java.util.Map;
import org.kwanta.model.NoConvergenceException;
import org.kwanta.model.OutOfValidityRangeException;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.http.HttpHeaders;
import org.springframework.http.HttpStatus;
import org.springframework.http.HttpStatusCode;
import org.springframework.http.MediaType;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.ExceptionHandler;
import org.springframework.web.bind.annotation.RestControllerAdvice;
import org.springframework.web.context.request.WebRequest;
import org.springframework.web.servlet.mvc.method.annotation.ResponseEntityExceptionHandler;

/**
 * Every error as {@code application/problem+json} with a stable {@code type}: Spring MVC's own
 * exceptions (unknown path, wrong method, malformed body...) through the base class, the engine's
 * through the handlers below. 500 only for bugs, with details in the log and never in the body.
 */
@RestControllerAdvice
class ProblemHandler extends ResponseEntityExceptionHandler {

  private static final Logger log = LoggerFactory.getLogger(ProblemHandler.class);

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

  @ExceptionHandler(BadRequestException.class)
  ResponseEntity<ProblemDetail> badRequest(BadRequestException e) {
    ProblemDetail problem = ProblemDetail.forStatusAndDetail(e.status(), e.getMessage());
    problem.setType(e.type());
    problem.setTitle(e.title());
    e.properties().forEach(problem::setProperty);
    return problem(problem);
  }

  @ExceptionHandler(Exception.class)
  ResponseEntity<ProblemDetail> unexpected(Exception e) {
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
