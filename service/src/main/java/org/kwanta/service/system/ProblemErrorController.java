package org.kwanta.service.system;

import jakarta.servlet.RequestDispatcher;
import jakarta.servlet.http.HttpServletRequest;
import org.springframework.boot.webmvc.error.ErrorController;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ProblemDetail;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RestController;

/**
 * Replaces Spring Boot's HTML/JSON error page for errors that happen outside Spring MVC (in
 * filters, in the servlet container): they too answer {@code application/problem+json}, never an
 * HTML page or a stack trace.
 */
@RestController
class ProblemErrorController implements ErrorController {

  @RequestMapping("${server.error.path:/error}")
  ResponseEntity<ProblemDetail> error(HttpServletRequest request) {
    Object code = request.getAttribute(RequestDispatcher.ERROR_STATUS_CODE);
    // requested directly (GET /error), nothing failed: the path is not a resource
    int status = code instanceof Integer i ? i : 404;
    HttpStatus httpStatus = HttpStatus.resolve(status);
    if (httpStatus == null) {
      httpStatus = HttpStatus.INTERNAL_SERVER_ERROR;
    }
    ProblemDetail problem =
        ProblemDetail.forStatusAndDetail(
            httpStatus,
            httpStatus.is5xxServerError()
                ? "An internal error occurred; it has been logged."
                : httpStatus.getReasonPhrase());
    problem.setType(ProblemTypes.forStatus(status));
    problem.setTitle(ProblemResponses.title(httpStatus));
    Object uri =
        code == null
            ? request.getRequestURI()
            : request.getAttribute(RequestDispatcher.ERROR_REQUEST_URI);
    if (uri != null) {
      problem.setInstance(java.net.URI.create(String.valueOf(uri).replace(" ", "%20")));
    }
    return ResponseEntity.status(httpStatus)
        .contentType(MediaType.APPLICATION_PROBLEM_JSON)
        .body(problem);
  }
}
